'use strict';
// A decision as the agents' pages show it (the answers page for a question asked there, the queue
// page for a ticket the queue decided). Every text from the service is placed as text.
const DecisionCard = (() => {
  const { el, confidencePercent, thresholdPercent, REASONS } = Precedent;

  /** The decision as a card: outcome, confidence against the threshold, caution, reply or reason. */
  function card(d) {
    const reply = d.outcome === 'REPLY';
    const box = el('section', { class: 'card decision ' + (reply ? 'reply' : 'hand-off'),
      id: 'decision', 'aria-labelledby': 'outcome' },
      el('p', { class: 'outcome', id: 'outcome' },
        reply ? 'REPLY: Precedent would answer this on its own' : 'HAND OFF: a person answers this'),
      // The one chance shown: the calibrated confidence that the best answer is right.
      el('p', { class: 'figures', id: 'confidence' }, 'Confidence '
        + confidencePercent(d.confidence, d.threshold) + ' that the best answer is right; '
        + thresholdPercent(d.threshold) + ' needed to reply on its own'
        + (d.modelVersion ? ' · model ' + d.modelVersion : '')));
    if (d.caution) {
      box.append(el('div', { class: 'caution', role: 'alert', id: 'caution' },
        el('h3', {}, 'Caution' + (d.safetyTopic ? ' (' + d.safetyTopic + ')' : '')
          + ': tell the customer this first'),
        el('p', {}, d.caution)));
    }
    if (reply) {
      box.append(el('h3', {}, 'The reply'), el('p', { class: 'answer' }, d.reply));
    } else {
      box.append(el('p', { id: 'reason' }, REASONS[d.reason] || ('Reason: ' + d.reason)));
    }
    if (d.template) {
      // Text only (el sets textContent): the marked slots are shown as typed, never as HTML.
      box.append(el('h3', {}, 'The answer, with the places to fill in marked'),
        el('p', { class: 'answer template', id: 'template' }, d.template));
    }
    if (d.explanation) box.append(el('p', { class: 'figures' }, d.explanation));
    if (d.truncated) box.append(el('p', { class: 'figures' }, 'The question was long: only its start was read.'));
    return box;
  }

  return { card };
})();
