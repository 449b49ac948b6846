'use strict';
// The manager's page: measured consequences of a threshold, applying one with a reason, the audit.
(() => {
  const { el, call, problem, setStatus, num, percent, threshold } = Precedent;
  const $ = id => document.getElementById(id);

  let report = null;   // the latest evaluation
  let system = null;   // its fused system: what the service decides with
  let rows = [];       // what each measured threshold would do, ascending by threshold
  let gated = false;   // whether the rows count the safety gate's hand-offs (newer evaluations)
  let inForce = null;  // GET /api/v1/threshold

  const BASIS = {
    RECOMMENDED: 'the guaranteed threshold of the evaluation',
    GIVEN: 'the threshold named when the evaluation was run',
    MEASURED: 'the measured threshold (no guarantee was possible)',
  };

  /** The recommended (guaranteed) threshold, or null when none could be guaranteed. */
  function recommended() {
    const r = system.recommendation;
    return r && r.status === 'OK' ? num(r.threshold) : null;
  }

  /** Index of the measured threshold equal to t, else the nearest one. */
  function indexOf(t) {
    let best = 0;
    rows.forEach((r, i) => {
      if (Math.abs(r.threshold - t) < Math.abs(rows[best].threshold - t)) best = i;
    });
    return best;
  }

  function chosen() {
    return rows[Number($('threshold').value)];
  }

  function mark(t, kind, label) {
    const r = rows[indexOf(t)];
    if (!r || r.answered === 0) return { kind };
    const exact = r.threshold === t ? '' : ' (nearest measured: ' + threshold(r.threshold) + ')';
    return { kind, threshold: threshold(t), coverage: num(r.answeredShare), risk: 1 - num(r.precision),
      label: label + ' ' + threshold(t) + exact + ': ' + percent(r.answeredShare) + ' answered, '
        + percent(1 - num(r.precision)) + ' of them wrong' };
  }

  function showFigures() {
    const r = chosen();
    const t = threshold(r.threshold);
    $('threshold-value').textContent = t;
    $('threshold').setAttribute('aria-valuetext', t);
    $('answered-share').textContent = percent(r.answeredShare);
    $('answered-count').textContent = r.answered + ' of ' + report.tickets + ' held-out tickets';
    $('precision').textContent = percent(r.precision);
    $('precision-interval').textContent = r.answered === 0 ? 'n/a (nothing answered)'
      : percent(r.precisionLower) + ' to ' + percent(r.precisionUpper);
    const wrong = num(r.wrongPerThousand);
    $('wrong-per-thousand').textContent = Number.isFinite(wrong) ? wrong.toFixed(1) : 'n/a';
    $('safety-hand-offs').textContent = gated ? String(r.safetyHandOffs) : 'n/a';
    $('safety-label').textContent = gated
      ? 'handed to a person by the safety gate although their confidence reached ' + t + ' ('
        + system.safetyHandOffs + ' of ' + report.tickets + ' held-out tickets fall under it)'
      : 'handed off by the safety gate: not recorded in this evaluation';
    $('apply').textContent = 'Apply threshold ' + t;
    const rec = recommended();
    $('use-recommended').disabled = rec !== null && r.threshold === rec;
    const marks = [mark(num(inForce.global), 'in-force', 'In force')];
    if (rec !== null) marks.push(mark(rec, 'recommended', 'Guaranteed'));
    marks.push(mark(r.threshold, 'chosen', 'Chosen'));
    $('chart').replaceChildren(Curve.draw(curve(), marks));
  }

  /** The curve of what the rows would do; the model's own curve for evaluations without them. */
  function curve() {
    if (!gated) return system.riskCoverage;
    return rows.filter(r => r.answered > 0)
      .map(r => ({ coverage: num(r.answeredShare), risk: 1 - num(r.precision) }));
  }

  function showRecommendation() {
    const rec = recommended();
    const button = $('use-recommended');
    button.hidden = rec === null;
    if (rec !== null) {
      const r = system.recommendation;
      button.textContent = 'Choose the guaranteed threshold ' + threshold(rec);
      $('recommendation').textContent = 'Guaranteed: with probability ' + percent(1 - num(report.delta))
        + ' its replies are at least ' + percent(r.targetPrecision) + ' right (measured on the model '
        + 'alone: ' + percent(r.coverage) + ' answered, ' + percent(r.empiricalPrecision) + ' right).';
    } else {
      $('recommendation').textContent = 'No threshold could be guaranteed to reach '
        + percent(report.targetPrecision) + ' right replies on these held-out tickets.';
    }
  }

  function showInForce() {
    const overrides = Object.entries(inForce.perCategory || {});
    const global = num(inForce.global);
    const measured = rows.some(r => r.threshold === global);
    $('in-force').textContent = 'In force now: ' + threshold(global)
      + (overrides.length ? '; own thresholds for ' + overrides.map(([c, v]) => c + ' ' + threshold(v)).join(', ') : '')
      + (inForce.modelVersion ? ' (model ' + inForce.modelVersion + ')' : '') + '.'
      + (measured ? '' : ' The evaluation measured no threshold at exactly this value: the slider '
        + 'and the curve show the nearest one.');
  }

  function showCategories() {
    const table = system.categories;
    $('categories-note').textContent = 'Measured at threshold ' + threshold(table.threshold) + ', '
      + (BASIS[table.basis] || table.basis) + '. The evaluation keeps category results at that one '
      + 'threshold only, so this table does not follow the slider. '
      + (gated ? 'Questions the safety gate hands to a person (a safety rule, a people-only '
        + 'category or answer) count as handed off, as in service.'
        : 'This evaluation did not record the safety gate: its figures measure confidence alone. '
        + 'Run precedent evaluate again to see what the service would do.');
    const own = inForce.perCategory || {};
    $('categories').tBodies[0].replaceChildren(...table.rows.map(c => el('tr', {},
      el('th', { scope: 'row' }, c.category),
      el('td', { class: 'number' }, c.tickets),
      el('td', { class: 'number' }, c.inScope),
      el('td', { class: 'number' }, percent(c.top1)),
      el('td', { class: 'number' }, gated ? percent(c.serviceCoverage) + ' (' + c.serviceAnswered + ')'
        : percent(c.coverage) + ' (' + c.answered + ')'),
      el('td', { class: 'number' }, percent(gated ? c.servicePrecision : c.precision)),
      el('td', { class: 'number' }, gated ? c.safetyHandOffs : 'n/a'),
      el('td', { class: 'number' }, c.category in own ? threshold(own[c.category]) : '–'))));
  }

  let approvalAsked = 0;  // the latest request, so that a slow reply never overwrites a newer one

  /** Coverage and precision at the chosen threshold with and without the approval gate. */
  async function loadApproval() {
    const t = chosen().threshold;
    const asked = ++approvalAsked;
    const r = await call('GET', '/api/v1/threshold/approval?threshold=' + encodeURIComponent(String(t)));
    if (asked !== approvalAsked) return;
    const table = $('approval-additions');
    if (r.status !== 200) {
      $('approval-note').textContent = r.status === 404 ? problem(r) : 'Not available: ' + problem(r);
      $('approval-figures').hidden = true;
      table.hidden = true;
      $('approval-gain').textContent = '';
      return;
    }
    const a = r.json;
    $('approval-figures').hidden = false;
    $('approval-note').textContent = 'At threshold ' + threshold(a.threshold) + ', on the same '
      + a.withoutGate.tickets + ' held-out tickets, with the library as it is now ('
      + a.approvedAnswers + ' answers approved'
      + (a.approvalRequired ? '' : '; the queue also sends drafted answers here') + ').';
    $('gate-off-coverage').textContent = percent(a.withoutGate.coverage);
    $('gate-off-precision').textContent = percent(a.withoutGate.precision);
    $('gate-on-coverage').textContent = percent(a.withGate.coverage);
    $('gate-on-precision').textContent = percent(a.withGate.precision);
    const n = a.additions.length;
    $('approval-gain').textContent = n === 0 ? 'No drafted answer is held back at this threshold.'
      : 'Approving these ' + n + ' answer' + (n === 1 ? '' : 's') + ' would add '
        + num(a.pointsAdded).toFixed(1) + ' points of coverage (' + percent(a.afterApproving.precision)
        + ' of replies right then):';
    table.hidden = n === 0;
    table.tBodies[0].replaceChildren(...a.additions.map(x => el('tr', {},
      el('th', { scope: 'row' }, x.title),
      el('td', { class: 'number' }, x.tickets),
      el('td', { class: 'number' }, x.right),
      el('td', {}, x.ticketIds.join(', ') + (x.tickets > x.ticketIds.length ? ', …' : '')))));
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
    const t = chosen().threshold;
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

  /** The rows the slider steps over: what the service would do, or the model's grid in old reports. */
  function measuredRows(s) {
    gated = Array.isArray(s.service) && s.service.length > 0;
    const list = gated ? s.service : s.thresholds;
    return list.map(r => Object.assign({}, r, { threshold: num(r.threshold) }))
      .sort((a, b) => a.threshold - b.threshold);
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
      rows = measuredRows(system);
      $('system-name').textContent = system.name;
      $('report-source').textContent = 'Evaluation of ' + report.dataset + ', ' + report.tickets
        + ' held-out tickets, made ' + report.createdAt.replace('T', ' ').replace(/\.\d+Z$|Z$/, '') + ' UTC.';
      $('service-note').textContent = gated ? 'The figures are what the service would have done: '
        + 'tickets the safety gate hands to a person count as handed off, whatever their confidence.'
        : 'This evaluation did not record the safety gate: the figures measure confidence alone, '
        + 'and in service the safety gate hands off more. Run precedent evaluate again.';
      $('threshold').max = String(rows.length - 1);
      $('threshold').value = String(indexOf(num(inForce.global)));
      showRecommendation();
      showInForce();
      showFigures();
      showCategories();
      await loadApproval();
    }
    await loadChanges();
  }

  document.addEventListener('DOMContentLoaded', () => {
    $('threshold').addEventListener('input', showFigures);
    $('threshold').addEventListener('change', loadApproval);
    $('use-recommended').addEventListener('click', () => {
      $('threshold').value = String(indexOf(recommended()));
      showFigures();
      loadApproval();
      $('threshold').focus();
    });
    $('apply-form').addEventListener('submit', apply);
    Precedent.start(load);
  });
})();
