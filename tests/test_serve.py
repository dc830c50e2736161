"""`conductor-atlas serve` over real http: each kind of file comes with the content type browsers need.

Why these types matter: browsers refuse a module script or a service worker that is not served with
a JavaScript MIME type (HTML spec, "fetch a single module script"; Service Workers spec, "Update"
step 9), and the manifest's registered type is application/manifest+json (W3C Web App Manifest, §
"Media type registration").
"""

from __future__ import annotations

import re
import socket
import threading
import urllib.error
import urllib.request

import pytest

from conductor_atlas.errors import AtlasError
from conductor_atlas.serve import make_server

EXPECTED = {
    "index.html": "text/html",
    "sw.js": "text/javascript",
    "static/register-sw.js": "text/javascript",
    "static/calc.js": "text/javascript",
    "js/org.transcrypt.__runtime__.js": "text/javascript",
    "site.webmanifest": "application/manifest+json",
    "materials.json": "application/json",
    "static/style.css": "text/css",
    "static/icons/atlas.svg": "image/svg+xml",
    "static/icons/atlas-192.png": "image/png",
    "materials/copper-annealed/resistivity-temperature.csv": "text/csv",
    "materials/copper-annealed/resistivity-temperature.json": "application/json",
}


@pytest.fixture(scope="module")
def http_site(built_site):
    server = make_server(built_site, port=0, quiet=True)
    thread = threading.Thread(target=server.serve_forever, daemon=True)
    thread.start()
    yield f"http://127.0.0.1:{server.server_address[1]}"
    server.shutdown()
    server.server_close()


@pytest.mark.parametrize("path, mime", sorted(EXPECTED.items()))
def test_content_type(http_site, built_site, path, mime):
    assert (built_site / path).is_file(), f"the built site has no {path}"
    with urllib.request.urlopen(f"{http_site}/{path}") as response:
        assert response.status == 200
        assert response.headers.get_content_type() == mime
        assert response.read() == (built_site / path).read_bytes()


def test_directory_url_serves_its_index(http_site, built_site):
    with urllib.request.urlopen(f"{http_site}/materials/copper-annealed/") as response:
        assert response.read() == (built_site / "materials/copper-annealed/index.html").read_bytes()


def test_missing_file_is_404(http_site):
    with pytest.raises(urllib.error.HTTPError) as info:
        urllib.request.urlopen(f"{http_site}/no-such-page.html")
    assert info.value.code == 404


def test_listens_on_loopback_only(built_site):
    server = make_server(built_site, port=0, quiet=True)
    try:
        assert server.server_address[0] == "127.0.0.1"
    finally:
        server.server_close()


def test_folder_without_a_site_is_refused(tmp_path):
    with pytest.raises(AtlasError, match="holds no built site"):
        make_server(tmp_path, port=0)


def raw_request(http_site: str, request_line: bytes) -> bytes:
    """Send one raw request line over a loopback socket; return all the server answered."""
    host, port = http_site.removeprefix("http://").split(":")
    with socket.create_connection((host, int(port)), timeout=10) as conn:
        conn.sendall(request_line + b"\r\nHost: 127.0.0.1\r\nConnection: close\r\n\r\n")
        chunks = []
        while chunk := conn.recv(65536):
            chunks.append(chunk)
    return b"".join(chunks)


@pytest.mark.parametrize("path", [b"/%00", b"/index.html%00.css", b"/materials/%00/", b"/static/%00style.css"])
def test_encoded_nul_byte_is_a_bad_request(http_site, path):
    """A path with an encoded NUL used to drop the connection with no answer (os.stat: embedded null byte)."""
    answer = raw_request(http_site, b"GET " + path + b" HTTP/1.1")
    assert answer.startswith(b"HTTP/1.0 400 "), answer[:200]


def test_security_policy_is_sent_as_headers(http_site, built_site):
    """The pages' meta policy as a header, plus what a meta tag cannot carry (CSP Level 3, §6.4.2:
    frame-ancestors is ignored in <meta>); nosniff (Fetch standard, "X-Content-Type-Options")."""
    page = (built_site / "index.html").read_text(encoding="utf-8")
    meta_policy = re.search(r'http-equiv="Content-Security-Policy" content="([^"]*)"', page).group(1)
    for path in ("index.html", "static/style.css", "no-such-page.html"):
        try:
            response = urllib.request.urlopen(f"{http_site}/{path}")
        except urllib.error.HTTPError as error:  # the 404 page carries the headers too
            response = error
        policy = response.headers["Content-Security-Policy"]
        assert [d.strip() for d in meta_policy.split(";")] == [d.strip() for d in policy.split(";")][:-1]
        assert policy.endswith("; frame-ancestors 'none'")
        assert response.headers["X-Content-Type-Options"] == "nosniff"
