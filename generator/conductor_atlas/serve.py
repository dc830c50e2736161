"""Serve a built site on 127.0.0.1 with the content types that module scripts and manifests need."""

from __future__ import annotations

import functools
import http.server
import urllib.parse
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


# The pages' own policy (templates/base.html, <meta http-equiv>) sent as headers too, with what a
# meta tag cannot carry: frame-ancestors (no other site may frame a page) and nosniff.
SECURITY_HEADERS = {
    "Content-Security-Policy": "default-src 'self'; script-src 'self'; style-src 'self'; img-src 'self' data:; "
                               "object-src 'none'; base-uri 'none'; form-action 'self'; frame-ancestors 'none'",
    "X-Content-Type-Options": "nosniff",
}


class SiteHandler(http.server.SimpleHTTPRequestHandler):
    extensions_map = {**http.server.SimpleHTTPRequestHandler.extensions_map, **CONTENT_TYPES}

    def end_headers(self) -> None:
        for name, value in SECURITY_HEADERS.items():
            self.send_header(name, value)
        super().end_headers()

    def send_head(self):
        if "\0" in urllib.parse.unquote(self.path):  # %00: no file name holds it (os.stat raised ValueError)
            self.send_error(400, "Bad request path (an encoded NUL byte)")
            return None
        return super().send_head()

    def log_message(self, format: str, *args) -> None:  # noqa: A002 - signature of the base class
        if self.server.quiet:  # type: ignore[attr-defined]
            return
        super().log_message(format, *args)


def make_server(folder: Path, port: int = 8000, host: str = "127.0.0.1", quiet: bool = False):
    if not 0 <= port <= 65535:
        raise AtlasError(f"--port must be a port number from 0 to 65535 (0: any free port), found {port}")
    try:
        has_site = (folder / "index.html").is_file()
    except OSError as exc:  # a name too long for the file system
        raise AtlasError(f"cannot read {folder} ({exc.strerror}); choose another --dir") from exc
    if not has_site:
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
