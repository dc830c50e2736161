"""Serve a built site with the content types that module scripts and manifests need.

On 127.0.0.1 by default; ``host`` "0.0.0.0" serves every address of the machine (tablets on a
workshop network). Browsers keep a site for offline use only from a secure origin: localhost, or
https, which the standard library's ssl serves from a certificate and key the user supplies.
"""

from __future__ import annotations

import functools
import sys
import http.server
import ssl
import urllib.parse
from pathlib import Path

from conductor_atlas.atlas_errors import AtlasError

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


class SiteServer(http.server.ThreadingHTTPServer):
    """The threading server with one-line request errors: a browser that closes a tab or drops a
    download mid-file (broken pipe, reset) is routine and says nothing; anything else prints one
    line naming the client, never a traceback."""

    quiet = False

    def handle_error(self, request, client_address) -> None:
        problem = sys.exc_info()[1]
        if isinstance(problem, (BrokenPipeError, ConnectionResetError, ConnectionAbortedError, TimeoutError)):
            return
        if not self.quiet:
            print(f"serve: a request from {client_address[0]} failed "
                  f"({problem.__class__.__name__}: {problem})", file=sys.stderr)


def tls_context(cert: Path, key: Path | None) -> ssl.SSLContext:
    """A server TLS context from a PEM certificate and its private key (or one file holding both)."""
    for name, path in (("--cert", cert), ("--key", key)):
        if path is not None and not path.is_file():
            raise AtlasError(f"{name} {path}: no such file")
    context = ssl.SSLContext(ssl.PROTOCOL_TLS_SERVER)
    try:
        context.load_cert_chain(str(cert), str(key) if key is not None else None)
    except (ssl.SSLError, OSError) as exc:
        raise AtlasError(f"--cert {cert}{f' --key {key}' if key else ''}: not a PEM certificate and its "
                         f"private key ({exc.__class__.__name__}: {exc})") from exc
    return context


def make_server(folder: Path, port: int = 8000, host: str = "127.0.0.1", quiet: bool = False,
                cert: Path | None = None, key: Path | None = None):
    """A threading HTTP server for ``folder``; with ``cert`` it speaks https only."""
    if key is not None and cert is None:
        raise AtlasError("--key needs --cert (the certificate that goes with it)")
    if not 0 <= port <= 65535:
        raise AtlasError(f"--port must be a port number from 0 to 65535 (0: any free port), found {port}")
    try:
        has_site = (folder / "index.html").is_file()
    except OSError as exc:  # a name too long for the file system
        raise AtlasError(f"cannot read {folder} ({exc.strerror}); choose another --dir") from exc
    if not has_site:
        raise AtlasError(f"{folder} holds no built site (no index.html); run `conductor-atlas build` first")
    context = tls_context(cert, key) if cert is not None else None
    handler = functools.partial(SiteHandler, directory=str(folder))
    try:
        server = SiteServer((host, port), handler)
    except OSError as exc:
        raise AtlasError(f"cannot listen on {host}:{port} ({exc.strerror}); try --port") from exc
    server.quiet = quiet  # type: ignore[attr-defined]
    if context is not None:
        # the handshake happens in the request's thread, so a slow or plain-http client holds up no other
        server.socket = context.wrap_socket(server.socket, server_side=True, do_handshake_on_connect=False)
    return server


def serve(folder: Path, port: int = 8000, host: str = "127.0.0.1", cert: Path | None = None,
          key: Path | None = None) -> None:
    server = make_server(folder, port, host, cert=cert, key=key)
    scheme = "https" if cert is not None else "http"
    shown = "this machine's address" if host in ("0.0.0.0", "::", "") else host
    print(f"Serving {folder} on {scheme}://{shown}:{server.server_address[1]}/ (Ctrl-C stops)")
    if cert is None and host not in ("127.0.0.1", "localhost", "::1"):
        print("Over plain http, other devices read the site but do not keep it for offline use; "
              "serve it with --cert and --key (https) for that.")
    try:
        server.serve_forever()
    except KeyboardInterrupt:
        pass
    finally:
        server.server_close()
