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

from conductor_atlas.atlas_errors import AtlasError
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


@pytest.mark.parametrize("path, mime", sorted(EXPECTED.items()))
def test_content_type(served_site, built_site, path, mime):
    assert (built_site / path).is_file(), f"the built site has no {path}"
    with urllib.request.urlopen(f"{served_site}/{path}") as response:
        assert response.status == 200
        assert response.headers.get_content_type() == mime
        assert response.read() == (built_site / path).read_bytes()


def test_directory_url_serves_its_index(served_site, built_site):
    with urllib.request.urlopen(f"{served_site}/materials/copper-annealed/") as response:
        assert response.read() == (built_site / "materials/copper-annealed/index.html").read_bytes()


def test_missing_file_is_404(served_site):
    with pytest.raises(urllib.error.HTTPError) as info:
        urllib.request.urlopen(f"{served_site}/no-such-page.html")
    assert info.value.code == 404


def test_listens_on_loopback_only_by_default(built_site):
    server = make_server(built_site, port=0, quiet=True)
    try:
        assert server.server_address[0] == "127.0.0.1"
    finally:
        server.server_close()


def test_folder_without_a_site_is_refused(tmp_path):
    with pytest.raises(AtlasError, match="holds no built site"):
        make_server(tmp_path, port=0)


def raw_request(served_site: str, request_line: bytes) -> bytes:
    """Send one raw request line over a loopback socket; return all the server answered."""
    host, port = served_site.removeprefix("http://").split(":")
    with socket.create_connection((host, int(port)), timeout=10) as conn:
        conn.sendall(request_line + b"\r\nHost: 127.0.0.1\r\nConnection: close\r\n\r\n")
        chunks = []
        while chunk := conn.recv(65536):
            chunks.append(chunk)
    return b"".join(chunks)


@pytest.mark.parametrize("path", [b"/%00", b"/index.html%00.css", b"/materials/%00/", b"/static/%00style.css"])
def test_encoded_nul_byte_is_a_bad_request(served_site, path):
    """A path with an encoded NUL used to drop the connection with no answer (os.stat: embedded null byte)."""
    answer = raw_request(served_site, b"GET " + path + b" HTTP/1.1")
    assert answer.startswith(b"HTTP/1.0 400 "), answer[:200]


def test_security_policy_is_sent_as_headers(served_site, built_site):
    """The pages' meta policy as a header, plus what a meta tag cannot carry (CSP Level 3, §6.4.2:
    frame-ancestors is ignored in <meta>); nosniff (Fetch standard, "X-Content-Type-Options")."""
    page = (built_site / "index.html").read_text(encoding="utf-8")
    meta_policy = re.search(r'http-equiv="Content-Security-Policy" content="([^"]*)"', page).group(1)
    for path in ("index.html", "static/style.css", "no-such-page.html"):
        try:
            response = urllib.request.urlopen(f"{served_site}/{path}")
        except urllib.error.HTTPError as error:  # the 404 page carries the headers too
            response = error
        policy = response.headers["Content-Security-Policy"]
        assert [d.strip() for d in meta_policy.split(";")] == [d.strip() for d in policy.split(";")][:-1]
        assert policy.endswith("; frame-ancestors 'none'")
        assert response.headers["X-Content-Type-Options"] == "nosniff"


# ------------------------------------------------------------------ serving tablets on a workshop network

def non_loopback_address() -> str | None:
    """This machine's address on its default route (a UDP connect sends nothing), or None."""
    try:
        with socket.socket(socket.AF_INET, socket.SOCK_DGRAM) as probe:
            probe.connect(("192.0.2.1", 9))  # TEST-NET-1 (RFC 5737): only picks the outgoing interface
            address = probe.getsockname()[0]
    except OSError:
        return None
    return None if address.startswith("127.") else address


def test_host_option_serves_other_addresses(built_site):
    server = make_server(built_site, port=0, host="0.0.0.0", quiet=True)
    threading.Thread(target=server.serve_forever, daemon=True).start()
    try:
        port = server.server_address[1]
        hosts = ["127.0.0.1"] + ([non_loopback_address()] if non_loopback_address() else [])
        for host in hosts:
            with urllib.request.urlopen(f"http://{host}:{port}/index.html", timeout=10) as answer:
                assert answer.status == 200 and b"Conductor Atlas" in answer.read()
    finally:
        server.shutdown()
        server.server_close()


def self_signed(folder, name: str = "workshop.test"):
    """A throw-away certificate and key made with openssl, as the README tells a user to make one."""
    import shutil
    import subprocess
    if shutil.which("openssl") is None:
        pytest.skip("openssl is not installed")
    cert, key = folder / "atlas-cert.pem", folder / "atlas-key.pem"
    subprocess.run(["openssl", "req", "-x509", "-newkey", "rsa:2048", "-nodes", "-days", "2",
                    "-subj", f"/CN={name}", "-addext", f"subjectAltName=DNS:{name},IP:127.0.0.1",
                    "-keyout", str(key), "-out", str(cert)], check=True, capture_output=True)
    return cert, key


def test_https_with_a_supplied_certificate(built_site, tmp_path):
    import ssl
    cert, key = self_signed(tmp_path)
    server = make_server(built_site, port=0, host="127.0.0.1", quiet=True, cert=cert, key=key)
    threading.Thread(target=server.serve_forever, daemon=True).start()
    try:
        trust = ssl.create_default_context(cafile=str(cert))   # the one certificate, trusted by hand
        with urllib.request.urlopen(f"https://127.0.0.1:{server.server_address[1]}/sw.js", context=trust,
                                    timeout=10) as answer:
            assert answer.status == 200 and answer.headers["Content-Type"].startswith("text/javascript")
    finally:
        server.shutdown()
        server.server_close()


def test_certificate_mistakes_are_one_line_messages(built_site, tmp_path):
    with pytest.raises(AtlasError, match=r"--cert .*no-such\.pem: no such file"):
        make_server(built_site, port=0, cert=tmp_path / "no-such.pem")
    with pytest.raises(AtlasError, match="--key needs --cert"):
        make_server(built_site, port=0, key=tmp_path / "key.pem")
    junk = tmp_path / "junk.pem"
    junk.write_text("not a certificate\n")
    with pytest.raises(AtlasError, match="not a PEM certificate and its private key"):
        make_server(built_site, port=0, cert=junk)


def test_every_folder_has_an_index_page(served_site, built_site):
    folders = [p for p in built_site.rglob("*") if p.is_dir()]
    assert len(folders) > 50
    assert [p for p in folders if not (p / "index.html").is_file()] == []
    with urllib.request.urlopen(f"{served_site}/materials/", timeout=10) as answer:
        page = answer.read().decode("utf-8")
    assert "<h1>Materials</h1>" in page
    for material in (built_site / "materials").iterdir():
        if material.is_dir():
            assert f'materials/{material.name}/index.html"' in page, f"materials/ does not list {material.name}"
    for folder in ("static/", "static/icons/", "js/"):
        with urllib.request.urlopen(f"{served_site}/{folder}", timeout=10) as answer:
            text = answer.read().decode("utf-8")
        assert "Directory listing" not in text and "nothing in it to read" in text, folder


def test_a_client_that_leaves_mid_file_prints_no_traceback(built_site, capfd):
    """A browser closing a tab while a file is on its way makes the server write into a closed
    connection (BrokenPipeError or ConnectionResetError in the request's thread): routine, so it says
    nothing; before, socketserver printed a traceback for each. Any other failure is one line naming
    the client. (Called as the server calls it, from inside the except block of the request.)"""
    server = make_server(built_site, port=0, quiet=False)
    try:
        for problem in (BrokenPipeError(32, "Broken pipe"), ConnectionResetError(104, "Connection reset by peer")):
            try:
                raise problem
            except OSError:
                server.handle_error(None, ("192.0.2.7", 50000))
        assert capfd.readouterr().err == ""
        try:
            raise ValueError("odd request")
        except ValueError:
            server.handle_error(None, ("192.0.2.7", 50000))
        err = capfd.readouterr().err
        assert "Traceback" not in err
        assert err.strip() == "serve: a request from 192.0.2.7 failed (ValueError: odd request)"
    finally:
        server.server_close()
