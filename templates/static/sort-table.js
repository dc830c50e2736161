// Sort a table by clicking (or pressing Enter/Space on) a column heading. Cells carry data-sort.
function sortTable(table, index, ascending) {
  const body = table.tBodies[0];
  const rows = Array.from(body.rows);
  const key = (row) => {
    const cell = row.cells[index];
    const raw = cell.dataset.sort;
    if (raw === undefined) return null;
    const number = Number(raw);
    return Number.isFinite(number) && raw.trim() !== '' && index > 0 ? number : raw.toLowerCase();
  };
  rows.sort((a, b) => {
    const ka = key(a);
    const kb = key(b);
    if (ka === null && kb === null) return 0;
    if (ka === null) return 1;   // rows without a value go last either way
    if (kb === null) return -1;
    const order = ka < kb ? -1 : ka > kb ? 1 : 0;
    return ascending ? order : -order;
  });
  for (const row of rows) body.appendChild(row);
}

for (const table of document.querySelectorAll('table.sortable')) {
  const headers = Array.from(table.tHead.rows[0].cells);
  headers.forEach((th, index) => {
    if (th.hasAttribute('data-no-sort')) return;
    const button = document.createElement('button');
    button.type = 'button';
    button.className = 'sort-button';
    while (th.firstChild) button.appendChild(th.firstChild);
    th.appendChild(button);
    th.setAttribute('aria-sort', index === 1 ? 'ascending' : 'none');
    button.addEventListener('click', () => {
      const ascending = th.getAttribute('aria-sort') !== 'ascending';
      headers.forEach((other) => other.setAttribute('aria-sort', 'none'));
      th.setAttribute('aria-sort', ascending ? 'ascending' : 'descending');
      sortTable(table, index, ascending);
    });
  });
}
