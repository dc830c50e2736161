// Conductor Atlas: the "#" beside every table, row and section is a link to it; following it also
// copies the full address, ready to paste into a design note. Plain script, no imports.
(function () {
  function announce(text) {
    let status = document.getElementById('copy-link-status');
    if (!status) {
      status = document.createElement('p');
      status.id = 'copy-link-status';
      status.className = 'copy-link-status';
      status.setAttribute('role', 'status');
      document.body.appendChild(status);
    }
    status.textContent = text;
    clearTimeout(announce.timer);
    announce.timer = setTimeout(() => { status.textContent = ''; }, 2500);
  }
  document.addEventListener('click', (event) => {
    const link = event.target.closest('a.row-link, a.anchor');
    if (!link || !navigator.clipboard || !window.isSecureContext) return;
    const url = new URL(link.getAttribute('href'), window.location.href).href;
    navigator.clipboard.writeText(url).then(() => announce('Link copied: ' + url), () => {});
  });
})();
