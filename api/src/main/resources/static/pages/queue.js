'use strict';
// The queue page: the queue's tickets newest first, filtered and paged by the service, and one
// ticket's decision or failure. Every text from the service is placed as text.
(() => {
  const { el, call, problem, setStatus, confidence } = Precedent;
  const $ = id => document.getElementById(id);
  const SIZE = 25;
  let page = 1;

  const STATE_WORDS = { RECEIVED: 'received', REPLIED: 'replied', HANDED_OFF: 'handed off',
    FAILED: 'failed' };

  function when(iso) {
    return iso ? iso.replace('T', ' ').replace(/\.\d+Z$|Z$/, '') : '';
  }

  function why(t) {
    if (t.state === 'FAILED') return t.failure || '';
    if (t.reason) return t.reason.replace(/_/g, ' ');
    // A ticket waiting for another try says why the last one failed.
    return t.failure ? 'last try failed: ' + t.failure : '';
  }

  async function list() {
    const params = new URLSearchParams({ page: String(page), size: String(SIZE) });
    const search = $('search').value.trim();
    if (search) params.set('search', search);
    if ($('state').value) params.set('state', $('state').value);
    if ($('reason').value) params.set('reason', $('reason').value);
    const r = await call('GET', '/api/v1/queue/tickets?' + params);
    if (r.status !== 200) return setStatus($('list-status'), problem(r), true);
    const got = r.json;
    const pages = Math.max(1, Math.ceil(got.total / got.size));
    setStatus($('list-status'), got.total + (got.total === 1 ? ' ticket' : ' tickets')
      + (got.total ? ', page ' + got.page + ' of ' + pages : ''), false);
    $('newer').disabled = got.page <= 1;
    $('older').disabled = got.page >= pages;
    $('tickets').tBodies[0].replaceChildren(...got.tickets.map(t => el('tr', { 'data-state': t.state },
      el('td', {}, el('button', { type: 'button', class: 'link ticket-id', 'data-id': t.ticketId,
        onclick: () => open(t.ticketId) }, t.ticketId)),
      el('td', {}, when(t.submittedAt)),
      el('td', { class: 'state' }, STATE_WORDS[t.state] || t.state),
      el('td', { class: 'why' }, why(t)),
      el('td', { class: 'number' }, t.confidence === null ? '' : confidence(t.confidence, t.threshold)),
      el('td', { class: 'question' }, t.question))));
  }

  async function open(id) {
    const r = await call('GET', '/api/v1/queue/tickets/' + encodeURIComponent(id));
    if (r.status !== 200) return setStatus($('list-status'), problem(r), true);
    show(r.json);
  }

  function show(t) {
    $('detail').hidden = false;
    $('detail-title').textContent = 'Ticket ' + t.ticketId;
    $('detail-facts').textContent = t.status.toLowerCase() + ' · received ' + when(t.submittedAt)
      + (t.decidedAt ? ' · decided ' + when(t.decidedAt) : '')
      + (t.category ? ' · category ' + t.category : '')
      + ' · ' + t.attempts + (t.attempts === 1 ? ' try' : ' tries');
    $('detail-question').textContent = t.question;
    $('detail-failure').hidden = !(t.status === 'FAILED' || (t.failure && !t.decision));
    $('detail-failure-text').textContent = t.failure || '';
    const d = t.decision;
    $('detail-decision').replaceChildren(...(d ? [DecisionCard.card(d)] : []));
    // A hand-off still names the answer that came closest: the agent may send it, edited.
    const best = d && d.outcome !== 'REPLY' && d.candidates && d.candidates.length ? d.candidates[0] : null;
    $('detail-best').hidden = !best;
    $('detail-best-text').textContent = best ? best.answer : '';
    $('detail').scrollIntoView({ block: 'start' });
  }

  document.addEventListener('DOMContentLoaded', () => {
    $('filter-form').addEventListener('submit', ev => { ev.preventDefault(); page = 1; list(); });
    $('newer').addEventListener('click', () => { page -= 1; list(); });
    $('older').addEventListener('click', () => { page += 1; list(); });
    Precedent.start(list);
  });
})();
