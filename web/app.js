// forehalo web view: reads the form, calls POST /v1/sightlines and draws the results.
import { drawFieldChart } from './field-chart.js';
import { escapeHtml, fmt, fmtInterval } from './format.js';
import { createGalaxyTable } from './galaxy-table.js';
import { drawHistogram } from './histogram.js';
import { drawScatter } from './scatter.js';

const $ = (id) => document.getElementById(id);
const form = $('query-form');
const status = $('form-status');
const tooltip = $('tooltip');
const table = createGalaxyTable($('galaxy-table'));
let lastUrls = [];

/** Model choices come from the server's own OpenAPI document so the form never drifts from it. */
async function loadModelChoices() {
  const fallback = { shmr: ['moster2013'], profile: ['mnfw'] };
  let choices = fallback;
  try {
    const doc = await (await fetch('v1/openapi.json')).json();
    const model =
      doc.paths['/v1/sightlines'].post.requestBody.content['application/json'].schema.properties.model;
    const props = model.properties ?? model.anyOf?.find((s) => s.properties)?.properties;
    const profileKinds = (props.profile.oneOf ?? props.profile.anyOf ?? [])
      .map((s) => s.properties?.kind?.const ?? s.properties?.kind?.enum?.[0])
      .filter(Boolean);
    choices = {
      shmr: props.shmr.enum ?? fallback.shmr,
      profile: profileKinds.length ? profileKinds : fallback.profile,
    };
  } catch {
    // keep the fallback; the server validates anyway
  }
  const labels = {
    nfw: 'NFW (gas traces dark matter)',
    mnfw: 'modified NFW (cored inner gas)',
    mb04: 'adiabatic cored (Maller–Bullock)',
  };
  $('shmr').replaceChildren(...choices.shmr.map((v) => new Option(v, v)));
  $('profile').replaceChildren(...choices.profile.map((v) => new Option(labels[v] ?? v, v)));
  $('profile').value = choices.profile.includes('mnfw') ? 'mnfw' : choices.profile[0];
}

async function loadCatalogs() {
  const list = $('catalog-list');
  try {
    const reply = await (await fetch('v1/catalogs')).json();
    const names = (reply.catalogs ?? []).map((c) => c.name).filter(Boolean);
    if (names.length === 0) {
      list.innerHTML = '<span class="muted">No catalogues stored yet.</span>';
      return;
    }
    list.replaceChildren(
      ...names.map((name) => {
        const label = document.createElement('label');
        const box = Object.assign(document.createElement('input'), {
          type: 'checkbox',
          name: 'catalogs',
          value: name,
          checked: true,
        });
        label.append(box, ` ${name}`);
        return label;
      }),
    );
  } catch {
    list.innerHTML = '<span class="muted">Could not list catalogues.</span>';
  }
}

function numberField(name) {
  const raw = form.elements[name].value.trim();
  return raw === '' ? undefined : Number(raw);
}

function requestBody() {
  const body = {
    ra: numberField('ra'),
    dec: numberField('dec'),
    z_source: numberField('z_source'),
    include_draws: true,
    model: {
      shmr: form.elements.shmr.value,
      profile: { kind: form.elements.profile.value },
      f_hot: numberField('f_hot'),
      extent: numberField('extent'),
      draws: numberField('draws'),
      seed: numberField('seed'),
    },
  };
  const zErr = numberField('z_source_err');
  if (zErr !== undefined) body.z_source_err = zErr;
  const host = form.elements.host_id.value.trim();
  if (host) body.host_id = host;
  const chosen = [...form.querySelectorAll('input[name="catalogs"]:checked')].map((b) => b.value);
  const all = form.querySelectorAll('input[name="catalogs"]').length;
  if (chosen.length > 0 && chosen.length < all) body.catalogs = chosen;
  for (const [k, v] of Object.entries(body.model)) if (v === undefined) delete body.model[k];
  if (body.model.extent !== undefined) body.model.search = Math.max(2, body.model.extent);
  return body;
}

function showTooltip(g, ev) {
  const lines = g.environment
    ? [`<strong>${escapeHtml(g.id)}</strong> (burst environment)`, `z = ${fmt(g.z, 4)}`]
    : [
        `<strong>${escapeHtml(g.id)}</strong> · ${escapeHtml(g.catalog)} · ${g.z_kind === 'photo' ? 'photo-z' : 'spec-z'}`,
        `z = ${fmt(g.z, 4)}${g.z_err ? ` ± ${fmt(g.z_err, 4)}` : ''} · P(fg) = ${fmt(g.p_fg, 2)}`,
        `b = ${fmt(g.b_kpc, 1)} kpc (${fmt(g.sep_arcsec, 1)}″) · b/r_halo = ${fmt(g.b_over_rhalo, 2)}`,
        `log M★ = ${fmt(g.log_mstar, 2)} · log M_h = ${fmt(g.log_mhalo, 2)} · r_halo = ${fmt(g.r_halo_kpc, 0)} kpc`,
        `DM = ${fmtInterval(g.dm)} pc cm⁻³`,
        g.flags?.length ? `flags: ${escapeHtml(g.flags.join(', '))}` : '',
      ];
  tooltip.innerHTML = lines.filter(Boolean).join('<br>');
  tooltip.hidden = false;
  const rect = ev.target.getBoundingClientRect?.();
  const px = ev.clientX ?? (rect ? rect.right : 0);
  const py = ev.clientY ?? (rect ? rect.top : 0);
  tooltip.style.left = `${Math.min(px + 14, window.innerWidth - 360)}px`;
  tooltip.style.top = `${py + 14}px`;
}
const hideTooltip = () => {
  tooltip.hidden = true;
};
const hover = { onHover: showTooltip, onLeave: hideTooltip, onSelect: (g) => table.highlight(g.id) };

function renderSummary(result) {
  const t = result.totals;
  $('summary').innerHTML = `
    <div><div class="muted">Foreground haloes, median DM</div>
      <div class="big" id="total-dm">${fmtInterval(t.dm_halos)} <span class="unit">pc cm⁻³</span></div></div>
    <dl>
      <div><dt>mean</dt><dd>${fmt(t.dm_halos.mean, 1)}</dd></div>
      <div><dt>2.5–97.5 %</dt><dd>${fmt(t.dm_halos.p2_5, 1)} – ${fmt(t.dm_halos.p97_5, 1)}</dd></div>
      <div><dt>candidates</dt><dd id="n-candidates">${t.n_candidates}</dd></div>
      <div><dt>intersected</dt><dd>${t.n_intersected}</dd></div>
      <div><dt>draws · seed</dt><dd>${t.draws} · ${t.seed}</dd></div>
    </dl>`;
}

function listItem(text, className) {
  const li = document.createElement('li');
  li.textContent = text;
  if (className) li.className = className;
  return li;
}

function renderLists(result) {
  const priorities = (result.priorities ?? []).map((p) =>
    listItem(
      `${p.id} (${p.catalog}) — z = ${fmt(p.z, 3)} ± ${fmt(p.z_err, 3)}, P(fg) = ${fmt(p.p_fg, 2)}; ` +
        `a spectroscopic z would remove ${fmt(100 * p.var_fraction, 0)} % of the DM variance`,
    ),
  );
  $('priorities').replaceChildren(
    ...(priorities.length ? priorities : [listItem('No photometric neighbour needs a redshift.', 'muted')]),
  );
  const warnings = (result.warnings ?? []).map((w) =>
    listItem(typeof w === 'string' ? w : `${w.message}${w.code ? ` [${w.code}]` : ''}`),
  );
  $('warnings').replaceChildren(...(warnings.length ? warnings : [listItem('None.', 'muted')]));
}

/** Saves a Blob under a file name through a temporary link. */
function saveBlob(blob, fileName) {
  for (const url of lastUrls) URL.revokeObjectURL(url);
  const url = URL.createObjectURL(blob);
  lastUrls = [url];
  const a = Object.assign(document.createElement('a'), { href: url, download: fileName });
  document.body.append(a);
  a.click();
  a.remove();
}

function setDownloads(result, body) {
  const jsonButton = $('download-json');
  const csvButton = $('download-csv');
  jsonButton.disabled = false;
  csvButton.disabled = false;
  jsonButton.onclick = () =>
    saveBlob(new Blob([JSON.stringify(result, null, 2)], { type: 'application/json' }), 'sightline.json');
  csvButton.onclick = async () => {
    const { include_draws, ...csvBody } = body;
    const res = await fetch('v1/sightlines?format=csv', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(csvBody),
    });
    saveBlob(await res.blob(), 'sightline-galaxies.csv');
  };
}

async function submit(ev) {
  ev.preventDefault();
  const button = $('run');
  button.disabled = true;
  status.className = 'status';
  status.textContent = 'Tracing…';
  try {
    const body = requestBody();
    const res = await fetch('v1/sightlines', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(body),
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
    renderSummary(reply);
    drawFieldChart($('field-chart'), reply, hover);
    drawHistogram($('histogram-box'), reply.draws_dm ?? [], reply.totals.dm_halos);
    drawScatter($('scatter-box'), reply.galaxies, hover);
    table.setRows(reply.galaxies);
    renderLists(reply);
    setDownloads(reply, body);
    document.dispatchEvent(new CustomEvent('forehalo:sightline', { detail: { request: body, reply } }));
    status.textContent = `${reply.galaxies.length} candidates · ${reply.totals.draws} draws`;
    document.body.dataset.state = 'done';
  } catch (err) {
    status.className = 'status error';
    status.textContent = `Request failed: ${err.message}`;
  } finally {
    button.disabled = false;
  }
}

function prefill() {
  const params = new URLSearchParams(location.search);
  for (const key of ['ra', 'dec', 'z_source', 'z_source_err', 'host_id']) {
    if (params.has(key)) form.elements[key].value = params.get(key);
  }
}

form.addEventListener('submit', submit);
prefill();
await Promise.all([loadModelChoices(), loadCatalogs()]);
document.body.dataset.ready = 'true';
