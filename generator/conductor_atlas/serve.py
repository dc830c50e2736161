"""Serve a built site on 127.0.0.1 with the content types that module scripts and manifests need."""

from __future__ import annotations

import functools
import http.server
from pathlib import Path

from conductor_atlas.errors import AtlasError

CONTENT_TYPES = {
    ".js": "text/javascript",
    ".mjs": "text/javascript",
    ".json": "application/json",
    ".webmanifest": "application/manifest+json",
    ".csv": "text/csv; charset=utf-8",
    ".svg": "image/svg+xml",
    ".css": "text/css",
    ".html": "text/html; charset=utf-8",
}


class SiteHandler(http.server.SimpleHTTPRequestHandler):
    extensions_map = {**http.server.SimpleHTTPRequestHandler.extensions_map, **CONTENT_TYPES}

    def log_message(self, format: str, *args) -> None:  # noqa: A002 - signature of the base class
        if self.server.quiet:  # type: ignore[attr-defined]
            return
        super().log_message(format, *args)


def make_server(folder: Path, port: int = 8000, host: str = "127.0.0.1", quiet: bool = False):
    if not (folder / "index.html").is_file():
        raise AtlasError(f"{folder} holds no built site (no index.html); run `conductor-atlas build` first")
    handler = functools.partial(SiteHandler, directory=str(folder))
    try:
        server = http.server.ThreadingHTTPServer((host, port), handler)
    except OSError as exc:
        raise AtlasError(f"cannot listen on {host}:{port} ({exc.strerror}); try --port") from exc
    server.quiet = quiet  # type: ignore[attr-defined]
    return server


def serve(folder: Path, port: int = 8000) -> None:
    server = make_server(folder, port)
    print(f"Serving {folder} on http://127.0.0.1:{server.server_address[1]}/ (Ctrl-C stops)")
    try:
        server.serve_forever()
    except KeyboardInterrupt:
        pass
    finally:
        server.server_close()
