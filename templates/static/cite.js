// Conductor Atlas: the "cite" button beside a table's downloads and beside each row's "#" link (both made here)
// copies a plain-text citation: the value(s) with units and conditions, the material, the sources
// with locators, the model, the data edition and the link. Plain script, no imports, so it runs
// from a copied folder opened as files too; where the clipboard is refused, the text is shown,
// selected, for copying by hand.
(function () {
  function cellText(cell) {
    return cell.textContent.replace(/\s+/g, ' ').trim();
  }

  function headers(table) {
    return Array.from(table.querySelectorAll('thead th')).map((th) => {
      const unit = th.querySelector('.unit');
      const unitText = unit ? cellText(unit) : '';
      const label = cellText(th).replace(unitText, '').trim();
      return { label: label, unit: unitText };
    });
  }

  function rowLine(heads, row) {
    const parts = [];
    Array.from(row.cells).forEach((cell, i) => {
      const head = heads[i];
      if (!head || cell.classList.contains('row-tools') || !head.label) return;
      const text = cellText(cell);
      if (!text) return;
      parts.push(head.label + ' = ' + text + (head.unit && !/[a-zA-Zµ°%]/.test(text.slice(-1)) ? ' ' + head.unit : ''));
    });
    return parts.join('; ');
  }

  // "<model>. <validity>": the table's model paragraph ("Model: <model>. <validity>. Sources: …"), so
  // the page carries that text once
  function modelOf(section) {
    const text = cellText(section.querySelector('p.model'));
    const end = text.lastIndexOf(' Sources: ');
    return text.slice('Model: '.length, end < 0 ? text.length : end).replace(/\.$/, '');
  }

  function link(id) {
    const here = window.location.href.split('#')[0];
    return here + '#' + id;
  }

  function citation(section, row) {
    const table = section.querySelector('table');
    const heads = headers(table);
    const edition = document.querySelector('[data-edition]');
    const lines = [];
    const what = section.dataset.citeMaterial + ': ' + section.dataset.citeTitle;
    if (row) {
      lines.push(what + ', one row');
      lines.push(rowLine(heads, row));
    } else {
      lines.push(what + ' (' + table.tBodies[0].rows.length + ' rows; columns: ' +
        heads.filter((h) => h.label).map((h) => h.label + (h.unit ? ' [' + h.unit + ']' : '')).join(', ') + ')');
    }
    lines.push('Model: ' + modelOf(section));
    lines.push('Sources: ' + section.dataset.citeSources);
    lines.push('Conductor Atlas, data edition ' + (edition ? edition.dataset.edition : 'unknown'));
    lines.push('Link: ' + link(row ? row.id : section.id));
    return lines.join('\n');
  }

  function show(text, copied) {
    let out = document.getElementById('cite-output');
    if (!out) {
      out = document.createElement('textarea');
      out.id = 'cite-output';
      out.className = 'cite-output';
      out.readOnly = true;
      out.rows = 7;
      out.setAttribute('aria-label', 'Citation');
      document.querySelector('main').appendChild(out);
    }
    out.value = text;
    out.dataset.copied = copied ? 'yes' : 'no';
    let status = document.getElementById('copy-link-status');
    if (!status) {
      status = document.createElement('p');
      status.id = 'copy-link-status';
      status.className = 'copy-link-status';
      status.setAttribute('role', 'status');
      document.body.appendChild(status);
    }
    status.textContent = copied ? 'Citation copied' : 'Citation shown below the page: select and copy it';
    if (!copied) {
      out.focus();
      out.select();
    }
  }

  function copyByCommand(text) {
    const area = document.createElement('textarea');
    area.value = text;
    area.setAttribute('readonly', '');
    area.style.position = 'fixed';
    area.style.opacity = '0';
    document.body.appendChild(area);
    area.select();
    let done = false;
    try { done = document.execCommand('copy'); } catch (e) { done = false; }
    document.body.removeChild(area);
    return done;
  }

  // Each data table row's last cell, its "#" link to the row and its cite button, is made here, with
  // the column's heading: the pages do not carry 100-200 copies of them (the bench's page weight);
  // without scripts a row is still reached by its id (tables.js lands a row link's target).
  function addRowTools() {
    for (const table of document.querySelectorAll('section[data-cite-material] table.data')) {
      const head = table.tHead && table.tHead.rows[0];
      if (!head || head.querySelector('th.link-col')) continue;
      const th = document.createElement('th');
      th.scope = 'col';
      th.className = 'link-col';
      const hidden = document.createElement('span');
      hidden.className = 'visually-hidden';
      hidden.textContent = 'Link';
      th.appendChild(hidden);
      head.appendChild(th);
      for (const row of table.tBodies[0].rows) {
        const cell = row.insertCell();
        cell.className = 'row-tools link-cell';
        const link = document.createElement('a');
        link.className = 'row-link';
        link.href = '#' + row.id;
        link.setAttribute('aria-label', 'Link to this row');
        link.textContent = '#';
        const button = document.createElement('button');
        button.type = 'button';
        button.className = 'cite';
        button.dataset.cite = 'row';
        button.setAttribute('aria-label', 'Copy a citation of this row');
        button.textContent = 'cite';
        cell.append(link, ' ', button);
      }
    }
  }

  if (document.readyState === 'loading') document.addEventListener('DOMContentLoaded', addRowTools);
  else addRowTools();

  document.addEventListener('click', (event) => {
    const button = event.target.closest('button.cite');
    if (!button) return;
    const section = button.closest('section[data-cite-material]');
    if (!section) return;
    const row = button.dataset.cite === 'row' ? button.closest('tr') : null;
    const text = citation(section, row);
    if (navigator.clipboard && window.isSecureContext) {
      navigator.clipboard.writeText(text).then(() => show(text, true), () => show(text, copyByCommand(text)));
    } else {
      show(text, copyByCommand(text));
    }
  });
})();
