'use strict';
// Evidence tickets: the past question with the words it shares with the new one marked.
const Evidence = (() => {
  const { el } = Precedent;

  /**
   * The text as nodes, with each span [start, end) wrapped in a mark. Spans come from the service;
   * overlapping or out-of-range ones are skipped rather than trusted.
   */
  function marked(text, spans) {
    const nodes = [];
    let at = 0;
    const sorted = (spans || []).slice().sort((a, b) => a.start - b.start);
    for (const s of sorted) {
      if (!(Number.isInteger(s.start) && Number.isInteger(s.end))) continue;
      if (s.start < at || s.end <= s.start || s.end > text.length) continue;
      if (s.start > at) nodes.push(document.createTextNode(text.slice(at, s.start)));
      nodes.push(el('mark', { title: 'shared word: ' + s.term }, text.slice(s.start, s.end)));
      at = s.end;
    }
    if (at < text.length) nodes.push(document.createTextNode(text.slice(at)));
    return nodes;
  }

  function item(e) {
    return el('li', { class: 'evidence-ticket' },
      el('span', { class: 'ticket-id' }, e.ticketId),
      e.category ? ' · ' + e.category : '',
      ' · match ' + Precedent.num(e.score).toFixed(1),
      el('div', { class: 'quoted' }, marked(e.question || '', e.spans)));
  }

  /** A list of evidence tickets, folded away except for the best suggestion. */
  function list(evidence, open) {
    const n = (evidence || []).length;
    return el('details', { open: open },
      el('summary', {}, n === 1 ? '1 past ticket behind this answer'
        : n + ' past tickets behind this answer'),
      el('ul', { class: 'evidence' }, (evidence || []).map(item)));
  }

  return { marked, list };
})();
