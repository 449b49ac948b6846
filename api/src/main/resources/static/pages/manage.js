'use strict';
// The manager's page: measured consequences of a threshold, applying one with a reason, the audit.
(() => {
  const { el, call, problem, setStatus, num, percent } = Precedent;
  const $ = id => document.getElementById(id);

  let report = null;   // the latest evaluation
  let system = null;   // its fused system: what the service decides with
  let inForce = null;  // GET /api/v1/threshold

  const BASIS = {
    RECOMMENDED: 'the guaranteed threshold of the evaluation',
    GIVEN: 'the threshold named when the evaluation was run',
    MEASURED: 'the measured threshold (no guarantee was possible)',
  };

  /** The threshold table's row nearest to t (the table has one row per 0.01). */
  function row(t) {
    let best = null;
    for (const r of system.thresholds) {
      if (best === null || Math.abs(r.threshold - t) < Math.abs(best.threshold - t)) best = r;
    }
    return best;
  }

  function mark(t, kind, label) {
    const r = row(t);
    if (!r || r.answered === 0) return { kind };
    return { kind, threshold: t.toFixed(2), coverage: num(r.answeredShare), risk: 1 - num(r.precision),
      label: label + ' ' + t.toFixed(2) + ': ' + percent(r.answeredShare) + ' answered, '
        + percent(1 - num(r.precision)) + ' of them wrong' };
  }

  function showFigures() {
    const t = Number($('threshold').value);
    const r = row(t);
    $('threshold-value').textContent = t.toFixed(2);
    $('answered-share').textContent = percent(r.answeredShare);
    $('answered-count').textContent = r.answered + ' of ' + report.tickets + ' held-out tickets';
    $('precision').textContent = percent(r.precision);
    $('precision-interval').textContent = r.answered === 0 ? 'n/a (nothing answered)'
      : percent(r.precisionLower) + ' to ' + percent(r.precisionUpper);
    const wrong = num(r.wrongPerThousand);
    $('wrong-per-thousand').textContent = Number.isFinite(wrong) ? wrong.toFixed(1) : 'n/a';
    $('apply').textContent = 'Apply threshold ' + t.toFixed(2);
    const marks = [mark(inForce.global, 'in-force', 'In force'), mark(t, 'chosen', 'Chosen')];
    $('chart').replaceChildren(Curve.draw(system.riskCoverage, marks));
  }

  function showInForce() {
    const overrides = Object.entries(inForce.perCategory || {});
    $('in-force').textContent = 'In force now: ' + num(inForce.global).toFixed(4)
      + (overrides.length ? '; own thresholds for ' + overrides.map(([c, v]) => c + ' ' + num(v).toFixed(2)).join(', ') : '')
      + (inForce.modelVersion ? ' (model ' + inForce.modelVersion + ')' : '') + '.';
  }

  function showCategories() {
    const table = system.categories;
    $('categories-note').textContent = 'Measured at threshold ' + num(table.threshold).toFixed(2) + ', '
      + (BASIS[table.basis] || table.basis) + '. The evaluation keeps category results at that one '
      + 'threshold only, so this table does not follow the slider. The figures measure confidence '
      + 'alone: in service, questions under a safety rule or in a people-only category are still '
      + 'handed off.';
    const own = inForce.perCategory || {};
    $('categories').tBodies[0].replaceChildren(...table.rows.map(c => el('tr', {},
      el('th', { scope: 'row' }, c.category),
      el('td', { class: 'number' }, c.tickets),
      el('td', { class: 'number' }, c.inScope),
      el('td', { class: 'number' }, percent(c.top1)),
      el('td', { class: 'number' }, percent(c.coverage) + ' (' + c.answered + ')'),
      el('td', { class: 'number' }, percent(c.precision)),
      el('td', { class: 'number' }, c.category in own ? num(own[c.category]).toFixed(2) : '–'))));
  }

  async function loadChanges() {
    const r = await call('GET', '/api/v1/threshold/changes');
    if (r.status !== 200) return;
    $('audit-empty').hidden = r.json.length > 0;
    $('audit').hidden = r.json.length === 0;
    $('audit').tBodies[0].replaceChildren(...r.json.slice(0, 50).map(c => el('tr', {},
      el('td', {}, c.changedAt.replace('T', ' ').replace(/\.\d+Z$|Z$/, '')),
      el('td', {}, c.changedBy), el('td', {}, c.old), el('td', {}, c.new), el('td', {}, c.reason))));
  }

  async function apply(ev) {
    ev.preventDefault();
    const status = $('apply-status');
    const reason = $('reason').value.trim();
    if (!reason) {
      $('reason').focus();
      return setStatus(status, 'Say why the threshold changes: the reason is kept in the audit list.', true);
    }
    const t = Number($('threshold').value);
    $('apply').disabled = true;
    // The service replaces category thresholds with what is sent, so the ones in force go along.
    const r = await call('PUT', '/api/v1/threshold',
      { global: t, perCategory: inForce.perCategory || {}, reason });
    $('apply').disabled = false;
    if (r.status !== 200) return setStatus(status, 'Not applied: ' + problem(r), true);
    setStatus(status, 'Applied: ' + r.json.old + ' → ' + r.json.new + '.');
    $('reason').value = '';
    inForce = (await call('GET', '/api/v1/threshold')).json || inForce;
    showInForce();
    showFigures();
    await loadChanges();
  }

  async function load() {
    const status = $('load-status');
    setStatus(status, 'Loading…');
    const current = await call('GET', '/api/v1/threshold');
    if (current.status !== 200) {
      if (current.status !== 401) setStatus(status, problem(current), true);
      return;
    }
    inForce = current.json;
    const evaluation = await call('GET', '/api/v1/threshold/evaluation');
    $('no-evaluation').hidden = evaluation.status !== 404;
    $('evaluation').hidden = evaluation.status !== 200;
    setStatus(status, evaluation.status === 200 || evaluation.status === 404 ? '' : problem(evaluation),
      evaluation.status !== 200 && evaluation.status !== 404);
    if (evaluation.status === 200) {
      report = evaluation.json;
      system = report.systems[report.systems.length - 1];
      $('system-name').textContent = system.name;
      $('report-source').textContent = 'Evaluation of ' + report.dataset + ', ' + report.tickets
        + ' held-out tickets, made ' + report.createdAt.replace('T', ' ').replace(/\.\d+Z$|Z$/, '') + ' UTC.';
      $('threshold').value = (Math.round(100 * num(inForce.global)) / 100).toFixed(2);
      showInForce();
      showFigures();
      showCategories();
    }
    await loadChanges();
  }

  document.addEventListener('DOMContentLoaded', () => {
    $('threshold').addEventListener('input', showFigures);
    $('apply-form').addEventListener('submit', apply);
    Precedent.start(load);
  });
})();
