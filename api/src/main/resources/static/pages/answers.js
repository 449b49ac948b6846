'use strict';
// The agents' page: ask, read the decision and the ranked answers, and say what was done with them.
(() => {
  const { el, call, problem, setStatus, confidencePercent } = Precedent;

  let asked = null; // the question and ticket id the shown suggestions answer

  async function sendFeedback(c, verdict, finalText, area, propose) {
    const buttons = area.querySelectorAll('button');
    buttons.forEach(b => { b.disabled = true; });
    const status = area.querySelector('.status');
    setStatus(status, 'Saving…');
    // The suggestion's text as shown: for an accepted answer, the text sent, which training learns.
    const body = { question: asked.question, answerGroup: c.answerGroup, verdict, suggestedText: c.answer };
    if (asked.ticketId) body.ticketId = asked.ticketId;
    if (finalText !== undefined) body.finalText = finalText;
    if (propose) body.propose = true;
    const r = await call('POST', '/api/v1/feedback', body);
    if (r.status === 201) {
      status.className = 'status confirmation';
      status.textContent = 'Recorded: ' + r.json.verdict.toLowerCase() + ' (feedback #' + r.json.id + ')'
        + (r.json.proposed ? '; proposed to the library\'s managers as this answer\'s next version' : '');
    } else {
      setStatus(status, 'Not recorded: ' + problem(r), true);
      buttons.forEach(b => { b.disabled = false; });
    }
  }

  function feedback(c) {
    const status = el('p', { class: 'status', role: 'status' });
    const editor = el('div', { hidden: true, class: 'editor' });
    const area = el('div', { class: 'feedback' });
    const text = el('textarea', { 'aria-label': 'Answer as you will send it', class: 'final-text' });
    text.value = c.answer;
    const propose = el('input', { type: 'checkbox', class: 'propose' });
    editor.append(el('label', {}, 'The answer as you will send it'), text,
      el('label', { class: 'inline' }, propose,
        ' Also propose it as this answer\'s next version in the library (a manager decides)'),
      el('div', { class: 'actions' }, el('button', { type: 'button', class: 'primary send-edit',
        onclick: () => {
          if (!text.value.trim()) return setStatus(status, 'The edited answer is empty.', true);
          sendFeedback(c, 'EDITED', text.value, area, propose.checked);
        } }, 'Send edited answer')));
    area.append(el('div', { class: 'actions' },
      el('button', { type: 'button', class: 'accept', onclick: () => sendFeedback(c, 'ACCEPTED', undefined, area) }, 'Accept'),
      el('button', { type: 'button', class: 'edit', onclick: () => { editor.hidden = false; text.focus(); } }, 'Edit'),
      el('button', { type: 'button', class: 'reject', onclick: () => sendFeedback(c, 'REJECTED', undefined, area) }, 'Reject')),
    editor, status);
    return area;
  }

  // Only the best answer has a calibrated chance (the decision's confidence); the others are
  // shown in order, without a second figure that would read as a chance.
  function suggestion(c, d) {
    const best = c.rank === 1;
    return el('li', { class: 'card suggestion', 'data-answer-group': c.answerGroup },
      el('div', { class: 'suggestion-head' },
        el('span', { class: 'rank', 'aria-label': 'rank ' + c.rank }, c.rank),
        best ? el('span', { class: 'best-label' }, 'Best answer · confidence '
          + confidencePercent(d.confidence, d.threshold)) : null,
        el('span', { class: 'figures' }, 'used in ' + c.usedTimes + ' past tickets'
          + (c.category ? ' · ' + c.category : ''))),
      el('p', { class: 'answer' }, c.answer),
      Evidence.list(c.evidence, best),
      feedback(c));
  }

  function show(d) {
    const result = document.getElementById('result');
    result.replaceChildren(DecisionCard.card(d));
    const list = d.candidates || [];
    result.append(el('h2', {}, list.length ? 'Past answers, best first' : 'No past answer fits this question'));
    result.append(el('p', { class: 'figures' }, 'The question as Precedent read it (cleaned and redacted): ',
      el('q', { id: 'read-question' }, d.question)));
    if (list.length) result.append(el('ol', { class: 'suggestions', id: 'suggestions' }, list.map(c => suggestion(c, d))));
  }

  async function ask(ev) {
    ev.preventDefault();
    const form = ev.target;
    const question = form.elements['question'].value;
    const category = form.elements['category'].value.trim();
    const ticketId = form.elements['ticket-id'].value.trim();
    const status = document.getElementById('ask-status');
    if (!question.trim()) return setStatus(status, 'Type the question first.', true);
    const button = document.getElementById('ask');
    button.disabled = true;
    setStatus(status, 'Looking through past tickets…');
    try {
      const body = { question, limit: 5 };
      if (category) body.category = category;
      const r = await call('POST', '/api/v1/suggestions', body);
      if (r.status === 200) {
        asked = { question, ticketId };
        show(r.json);
        setStatus(status, '');
      } else if (r.status !== 401) {
        setStatus(status, problem(r), true);
      }
    } finally {
      button.disabled = false;
    }
  }

  document.addEventListener('DOMContentLoaded', () => {
    document.getElementById('ask-form').addEventListener('submit', ask);
    Precedent.start(() => document.getElementById('question').focus());
  });
})();
