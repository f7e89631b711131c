// The DM-budget panel: DM_obs and DM_ISM inputs, POST /v1/budgets with the last traced sightline
// (position, catalogues, z_s and model, announced by app.js as a 'forehalo:sightline' event), then the
// waterfall of the terms and the host posterior. Holds no science: every number is the reply's.
import { drawBudgetWaterfall } from './budget-waterfall.js';
import { escapeHtml, fmt } from './format.js';
import { drawHostPosterior } from './host-posterior-chart.js';

const root = document.getElementById('budget-panel');
let lastSightline = null;

function field(id, label, hint) {
  return `<div class="budget-field">
    <label for="${id}">${label}</label>
    <input id="${id}" name="${id}" type="number" step="any" min="0" inputmode="decimal"${hint ? ` aria-describedby="${id}-hint"` : ''}>
    ${hint ? `<span id="${id}-hint" class="hint">${hint}</span>` : ''}
  </div>`;
}

function build() {
  root.innerHTML = `
    <h2 id="budget-heading">DM budget</h2>
    <p class="muted budget-intro">Splits the observed DM into Milky Way, cosmic, foreground-halo and host terms.
      forehalo ships no Galactic electron-density model: enter DM<sub>ISM</sub> from the model of your choice.</p>
    <form id="budget-form" class="budget-form" novalidate>
      ${field('budget-dm-obs', 'DM<sub>obs</sub> <span class="unit">[pc cm⁻³]</span>')}
      ${field('budget-dm-obs-err', '± 1σ <span class="unit">(optional)</span>')}
      ${field('budget-dm-ism', 'DM<sub>MW,ISM</sub> <span class="unit">[pc cm⁻³]</span>')}
      ${field('budget-dm-ism-err', '± 1σ <span class="unit">(optional)</span>')}
      <div class="budget-field">
        <label for="budget-cosmic-mode">Cosmic term</label>
        <select id="budget-cosmic-mode" name="budget-cosmic-mode">
          <option value="diffuse">diffuse IGM only (f_igm; haloes added separately)</option>
          <option value="full">full Macquart mean (f_d; counts halo gas twice)</option>
        </select>
      </div>
      <button id="budget-run" type="submit">Compute budget</button>
    </form>
    <p id="budget-source" class="muted">Trace a sightline to include its foreground haloes; without one the halo term is 0.</p>
    <p id="budget-status" class="status" role="status" aria-live="polite"></p>
    <div class="budget-charts">
      <figure class="budget-figure">
        <figcaption>Budget terms: medians, whiskers 16–84 %</figcaption>
        <div id="budget-waterfall-box" class="chart-box"></div>
      </figure>
      <figure class="budget-figure">
        <figcaption>Host DM posterior (rest frame), bins between percentiles 2.5–16–50–84–97.5 %</figcaption>
        <div id="host-posterior-box" class="chart-box"></div>
      </figure>
    </div>
    <div id="budget-summary" aria-live="polite"></div>
    <ul id="budget-notes" class="warnings"></ul>`;
}

const $ = (id) => document.getElementById(id);

function numberOf(id) {
  const raw = $(id).value.trim();
  return raw === '' ? undefined : Number(raw);
}

function prefill() {
  const params = new URLSearchParams(location.search);
  const map = {
    dm_obs: 'budget-dm-obs',
    dm_obs_err: 'budget-dm-obs-err',
    dm_ism: 'budget-dm-ism',
    dm_ism_err: 'budget-dm-ism-err',
  };
  for (const [key, id] of Object.entries(map)) if (params.has(key)) $(id).value = params.get(key);
}

/** The POST /v1/budgets body: the panel's inputs plus the last traced sightline, if any. */
function requestBody() {
  const body = { dm_obs: numberOf('budget-dm-obs'), dm_ism: numberOf('budget-dm-ism') };
  const obsErr = numberOf('budget-dm-obs-err');
  const ismErr = numberOf('budget-dm-ism-err');
  if (obsErr !== undefined) body.dm_obs_err = obsErr;
  if (ismErr !== undefined) body.dm_ism_err = ismErr;
  body.budget_model = { cosmic_mode: $('budget-cosmic-mode').value };
  if (lastSightline) {
    const s = lastSightline;
    body.z_source = s.z_source;
    body.sightline = { ra: s.ra, dec: s.dec };
    for (const key of ['catalogs', 'host_id', 'z_source_err', 'model'])
      if (s[key] !== undefined) body.sightline[key] = s[key];
  } else {
    const z = Number(document.getElementById('z_source')?.value);
    if (Number.isFinite(z) && z > 0) body.z_source = z;
  }
  return body;
}

function summaryTable(reply) {
  const rows = [
    ['Milky Way ISM', reply.components.mw_ism],
    ['Milky Way halo', reply.components.mw_halo],
    ['Cosmic', reply.components.cosmic],
    ['Foreground haloes', reply.components.halos],
  ];
  const cells = (s) =>
    s ? `<td>${fmt(s.p50, 1)}</td><td>${fmt(s.p16, 1)} – ${fmt(s.p84, 1)}</td>` : '<td>–</td><td>–</td>';
  const h = reply.host_rest;
  const zLines = reply.redshift_limit
    ? `<p>No source redshift: DM<sub>host</sub> ≥ 0 at ${fmt(reply.redshift_limit.confidence, 2)} confidence up to
        z<sub>s</sub> = ${fmt(reply.redshift_limit.z_max, 3)}; z<sub>s</sub> posterior median ${fmt(reply.redshift_posterior.median, 3)}
        (68 %: ${fmt(reply.redshift_posterior.interval68[0], 3)}–${fmt(reply.redshift_posterior.interval68[1], 3)}).</p>`
    : '';
  return `<table class="data budget-table">
      <caption>Budget terms, observer frame [pc cm⁻³]${reply.z_source ? ` at z<sub>s</sub> = ${fmt(reply.z_source, 4)}` : ''}</caption>
      <thead><tr><th scope="col">Term</th><th scope="col">median</th><th scope="col">16–84 %</th></tr></thead>
      <tbody>${rows.map(([name, s]) => `<tr><th scope="row">${name}</th>${cells(s)}</tr>`).join('')}
        ${h ? `<tr><th scope="row">Host, rest frame</th>${cells(h)}</tr>` : ''}</tbody>
    </table>
    ${
      reply.macquart_mean !== null
        ? `<p>⟨DM<sub>cosmic</sub>⟩(z<sub>s</sub>) (Macquart relation, f_d in force) = ${fmt(reply.macquart_mean, 1)} pc cm⁻³;
      P(DM<sub>host</sub> &lt; 0) = <strong id="budget-p-negative">${fmt(reply.p_negative_host, 3)}</strong>.</p>`
        : ''
    }
    ${zLines}`;
}

function renderNotes(reply) {
  const items = [
    ...reply.conventions.map((c) => ['convention', c]),
    ...reply.warnings.map((w) => ['warning', `${w.message} [${w.source}/${w.code}]`]),
    ...reply.cautions.map((c) => ['caution', c]),
  ];
  $('budget-notes').innerHTML = items
    .map(
      ([kind, text]) =>
        `<li class="note-${kind}"><span class="note-kind">${kind}</span> ${escapeHtml(text)}</li>`,
    )
    .join('');
}

async function submit(ev) {
  ev.preventDefault();
  const status = $('budget-status');
  const button = $('budget-run');
  button.disabled = true;
  status.className = 'status';
  status.textContent = 'Computing the budget…';
  try {
    const res = await fetch('v1/budgets', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(requestBody()),
    });
    const reply = await res.json();
    if (!res.ok) {
      const issues = reply.error?.details?.issues;
      status.className = 'status error';
      status.textContent = issues?.length
        ? issues.map((i) => `${i.field ?? i.key}: ${i.reason ?? i.message}`).join('; ')
        : (reply.error?.message ?? `HTTP ${res.status}`);
      return;
    }
    drawBudgetWaterfall($('budget-waterfall-box'), reply);
    drawHostPosterior($('host-posterior-box'), reply);
    $('budget-summary').innerHTML = summaryTable(reply);
    renderNotes(reply);
    status.textContent = `${reply.draws} draws · seed ${reply.seed} · ${reply.halos_source.description}`;
    root.dataset.state = 'done';
  } catch (err) {
    status.className = 'status error';
    status.textContent = `Request failed: ${err.message}`;
  } finally {
    button.disabled = false;
  }
}

if (root) {
  build();
  prefill();
  $('budget-form').addEventListener('submit', submit);
  document.addEventListener('forehalo:sightline', (ev) => {
    lastSightline = ev.detail.request;
    const s = lastSightline;
    $('budget-source').textContent =
      `Foreground haloes from the sightline traced at RA ${fmt(s.ra, 4)}°, Dec ${fmt(s.dec, 4)}°, ` +
      `z_s = ${s.z_source} (re-run by the server with include_draws).`;
  });
  const link = Object.assign(document.createElement('link'), { rel: 'stylesheet', href: 'budget.css' });
  document.head.append(link);
  root.dataset.ready = 'true';
}
