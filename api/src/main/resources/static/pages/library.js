'use strict';
// The answer library: list and search, one answer's text, evidence and feedback, and for managers
// edit, approve and retire with a reason. Every text from the service is placed as text.
(() => {
  const { el, call, problem, setStatus } = Precedent;
  const $ = id => document.getElementById(id);
  let current = null;   // the answer open below the list
  let role = null;

  const STATE_WORDS = { DRAFTED: 'drafted', APPROVED: 'approved', RETIRED: 'retired' };

  function note(a) {
    const notes = [];
    if (a.changedUnderneath) notes.push('replies changed');
    if (!a.present) notes.push('group gone');
    if (a.slots.length) notes.push('has slots');
    return notes.join('; ');
  }

  async function list() {
    const params = new URLSearchParams();
    const search = $('search').value.trim();
    if (search) params.set('search', search);
    if ($('state').value) params.set('state', $('state').value);
    const r = await call('GET', '/api/v1/answers' + (params.toString() ? '?' + params : ''));
    if (r.status !== 200) return setStatus($('list-status'), problem(r), true);
    const answers = r.json.answers;
    setStatus($('list-status'), answers.length + ' answers'
      + (r.json.approvalRequired ? '; the queue replies only with approved ones.' : '.'), false);
    $('answers').tBodies[0].replaceChildren(...answers.map(a => el('tr', {},
      el('td', {}, el('button', { type: 'button', class: 'link', 'data-id': a.groupId,
        onclick: () => open(a.groupId) }, a.title)),
      el('td', { class: 'state' }, STATE_WORDS[a.state] || a.state),
      el('td', { class: 'number' }, String(a.sources.length)),
      el('td', { class: 'number' }, String(a.uses)),
      el('td', { class: 'number' }, a.accepted + ' / ' + a.editedByAgents + ' / ' + a.rejected),
      el('td', {}, note(a)))));
  }

  async function open(id) {
    const r = await call('GET', '/api/v1/answers/' + encodeURIComponent(id));
    if (r.status !== 200) return setStatus($('list-status'), problem(r), true);
    show(r.json);
  }

  function show(got) {
    const a = got.answer;
    current = a;
    $('detail').hidden = false;
    $('detail-title').textContent = a.title;
    $('detail-facts').textContent = STATE_WORDS[a.state] + ', version ' + a.version
      + (a.edited ? ', text edited' : ', text as grouping made it') + (a.category ? ', category '
      + a.category : '') + ' · answer ' + a.groupId;
    $('detail-underneath').hidden = !a.changedUnderneath;
    $('detail-text').textContent = a.text;
    $('detail-slots').textContent = a.slots.length
      ? 'Slots for the customer\'s details: ' + a.slots.join(', ') + ' (never sent automatically).' : '';
    $('detail-sources').textContent = a.sources.length + ' past replies: ' + a.sources.join(', ')
      + (a.present ? '' : ' (the group is no longer in the knowledge in force)');
    // An edit the agent proposed as the next version: a manager takes its text into the form,
    // and saving it (with a reason) makes the new version, audited like any edit.
    $('detail-edits').replaceChildren(...got.recentEdits.map(e => el('li', { class: e.proposed ? 'proposed' : null },
      el('span', { class: 'figures' }, e.recordedAt.replace('T', ' ').slice(0, 16) + ' ' + e.agent
        + (e.proposed ? ' proposed it as the next version' : '') + ': '),
      el('span', { class: 'answer' }, e.text),
      e.proposed && role === 'manager' ? el('button', { type: 'button', class: 'use-proposal',
        onclick: () => {
          $('edit-text').value = e.text;
          $('change-reason').value = 'proposed by ' + e.agent + ' on ' + e.recordedAt.slice(0, 10);
          $('edit-text').focus();
        } }, 'Use this text') : null)));
    $('detail-no-edits').hidden = got.recentEdits.length > 0;
    const form = $('change-form');
    form.hidden = role !== 'manager';
    form.elements['title'].value = a.title;
    form.elements['text'].value = a.text;
    form.elements['reason'].value = '';
    setStatus($('change-status'), '', false);
    $('audit').tBodies[0].replaceChildren(...got.changes.map(c => el('tr', {},
      el('td', {}, c.changedAt.replace('T', ' ').slice(0, 19)),
      el('td', {}, c.changedBy),
      el('td', {}, c.action.toLowerCase()),
      el('td', { class: 'answer' }, c.oldText === null ? '' : (c.oldState || '') + ': ' + c.oldText),
      el('td', { class: 'answer' }, c.newState + ': ' + c.newText),
      el('td', {}, c.reason))));
  }

  async function change(method, path, body) {
    const status = $('change-status');
    const reason = $('change-reason').value.trim();
    if (!reason) return setStatus(status, 'Say why: the reason is kept in the audit list.', true);
    const r = await call(method, path, Object.assign({ version: current.version, reason }, body || {}));
    if (r.status !== 200) {
      return setStatus(status, r.status === 409 ? problem(r) + ' Reopen the answer to see the change.'
        : problem(r), true);
    }
    await open(current.groupId);
    setStatus(status, 'Saved: version ' + r.json.version + ', ' + STATE_WORDS[r.json.state] + '.', false);
    list();
  }

  let wired = false;
  Precedent.start(async () => {
    const me = await call('GET', '/api/v1/me');
    role = me.json ? me.json.role : null;
    // Signing in again calls this again: the controls are wired once.
    if (wired) return list();
    wired = true;
    $('search-form').addEventListener('submit', ev => { ev.preventDefault(); list(); });
    $('change-form').addEventListener('submit', ev => {
      ev.preventDefault();
      const form = $('change-form');
      change('PUT', '/api/v1/answers/' + encodeURIComponent(current.groupId),
        { title: form.elements['title'].value, text: form.elements['text'].value });
    });
    $('approve').addEventListener('click', () =>
      change('POST', '/api/v1/answers/' + encodeURIComponent(current.groupId) + '/approval'));
    $('retire').addEventListener('click', () =>
      change('POST', '/api/v1/answers/' + encodeURIComponent(current.groupId) + '/retirement'));
    list();
  });
})();
