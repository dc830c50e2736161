"""Shared fixtures: the transpiled core in node, a built site, a served site, a browser."""

from __future__ import annotations

import os
import shutil
import threading
from pathlib import Path

import pytest

from tests.support.node_core import NodeCore, node_available

IN_CI = os.environ.get("CI") == "true"


@pytest.fixture(scope="session")
def catalogue():
    """The calculators' catalogue of the shipped data (shared by the whole run; read only)."""
    from tests.support.differential_cases import shipped_catalogue
    return shipped_catalogue()


@pytest.fixture(scope="session")
def transpiled_files():
    from conductor_atlas.transpile import transpile_core
    return transpile_core()


@pytest.fixture(scope="session")
def node_core(transpiled_files, tmp_path_factory):
    if not node_available():
        if IN_CI:
            pytest.fail("node is required in CI for the differential tests")
        pytest.skip("node is not installed")
    return NodeCore(transpiled_files, tmp_path_factory.mktemp("node-core"))


@pytest.fixture(scope="session")
def built_site(tmp_path_factory):
    """The shipped data set built once into a temporary folder."""
    from conductor_atlas.build import build
    out = tmp_path_factory.mktemp("site-build") / "site"
    build(out)
    return out


@pytest.fixture(scope="session")
def served_site(built_site):
    from conductor_atlas.serve import make_server
    server = make_server(built_site, port=0, quiet=True)
    thread = threading.Thread(target=server.serve_forever, daemon=True)
    thread.start()
    yield f"http://127.0.0.1:{server.server_address[1]}"
    server.shutdown()
    server.server_close()


CHROMIUM = "/usr/bin/chromium"
CHROMIUM_ARGS = ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
                 "--disable-background-networking", "--disable-component-update", "--disable-sync"]


@pytest.fixture(scope="session")
def browser():
    if not Path(CHROMIUM).exists() or shutil.which("chromium") is None:
        if IN_CI:
            pytest.fail("Debian's chromium is required in CI (apt-get install chromium)")
        pytest.skip("Debian's chromium is not installed")
    from playwright.sync_api import sync_playwright
    with sync_playwright() as p:
        b = p.chromium.launch(executable_path=CHROMIUM, args=CHROMIUM_ARGS)
        yield b
        b.close()
