// The candidate table: every column with its unit, sortable by clicking (or Enter on) its header.
import { fmt } from './format.js';

const COLUMNS = [
  { key: 'id', label: 'id', text: true },
  { key: 'catalog', label: 'catalogue', text: true },
  { key: 'z', label: 'z', digits: 4 },
  { key: 'z_kind', label: 'z kind', text: true },
  { key: 'sep_arcsec', label: 'sep [″]', digits: 1 },
  { key: 'b_kpc', label: 'b [kpc]', digits: 1 },
  { key: 'log_mstar', label: 'log M★ [M☉]', digits: 2 },
  { key: 'log_mhalo', label: 'log M_h [M☉]', digits: 2 },
  { key: 'r_halo_kpc', label: 'r_halo [kpc]', digits: 0 },
  { key: 'b_over_rhalo', label: 'b / r_halo', digits: 2 },
  { key: 'p_fg', label: 'P(fg)', digits: 2 },
  { key: 'dm50', label: 'DM₅₀ [pc cm⁻³]', digits: 1, get: (g) => g.dm?.p50 },
  { key: 'dm16', label: 'DM₁₆', digits: 1, get: (g) => g.dm?.p16 },
  { key: 'dm84', label: 'DM₈₄', digits: 1, get: (g) => g.dm?.p84 },
  { key: 'p_contributes', label: 'P(DM>0)', digits: 2 },
  { key: 'flags', label: 'flags', text: true, get: (g) => (g.flags ?? []).join(', ') },
];

const cellValue = (col, g) => (col.get ? col.get(g) : g[col.key]);

export function createGalaxyTable(table) {
  let rows = [];
  let sortKey = 'dm50';
  let descending = true;

  function render() {
    const col = COLUMNS.find((c) => c.key === sortKey);
    const sorted = [...rows].sort((a, b) => {
      const va = cellValue(col, a);
      const vb = cellValue(col, b);
      const cmp = col.text
        ? String(va ?? '').localeCompare(String(vb ?? ''))
        : (va ?? -Infinity) - (vb ?? -Infinity);
      return descending ? -cmp : cmp;
    });
    const head = document.createElement('thead');
    const tr = document.createElement('tr');
    for (const c of COLUMNS) {
      const th = document.createElement('th');
      th.scope = 'col';
      th.setAttribute('aria-sort', c.key === sortKey ? (descending ? 'descending' : 'ascending') : 'none');
      const button = document.createElement('button');
      button.type = 'button';
      button.textContent = c.label + (c.key === sortKey ? (descending ? ' ▾' : ' ▴') : '');
      button.addEventListener('click', () => {
        descending = c.key === sortKey ? !descending : !c.text;
        sortKey = c.key;
        render();
        table.querySelector(`th:not([aria-sort="none"]) button`)?.focus();
      });
      th.append(button);
      tr.append(th);
    }
    head.append(tr);
    const body = document.createElement('tbody');
    for (const g of sorted) {
      const row = document.createElement('tr');
      row.dataset.rowId = g.id;
      for (const c of COLUMNS) {
        const td = document.createElement('td');
        const v = cellValue(c, g);
        td.textContent = c.text ? String(v ?? '') : fmt(v, c.digits);
        if (c.text) td.className = 'text';
        row.append(td);
      }
      body.append(row);
    }
    const caption = table.querySelector('caption');
    table.replaceChildren(...(caption ? [caption] : []), head, body);
  }

  return {
    setRows(next) {
      rows = next;
      render();
    },
    highlight(id) {
      for (const row of table.querySelectorAll('tbody tr'))
        row.classList.toggle('selected', row.dataset.rowId === id);
      table.querySelector(`tbody tr.selected`)?.scrollIntoView({ block: 'nearest' });
    },
  };
}
