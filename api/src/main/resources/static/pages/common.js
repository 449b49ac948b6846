'use strict';
// What the pages share: signing in (the form itself, built into each page's #sign-in-card),
// calling the API, and building DOM nodes.
// Data from the service is only ever placed with textContent / text nodes, never parsed as markup.
const Precedent = (() => {
  const STORE = 'precedent.credentials';

  /** Why a decision went to a person, in a sentence, by the service's reason name. */
  const REASONS = {
    no_candidate: 'No past answer is close enough to propose.',
    safety_rule: 'The question touches a safety rule, so a person must answer.',
    human_only: 'This kind of question is answered by people only.',
    answer_incomplete: 'The best answer lacks a detail that was removed from past replies; '
      + 'a person fills it in.',
    needs_customer_details: 'Past customers got this answer with their own details (a day, an '
      + 'amount, a reference); a person fills in this customer\'s.',
    below_threshold: 'Precedent is not sure enough to reply on its own.',
    answer_not_approved: 'The best answer is not approved in the answer library yet, and the queue '
      + 'replies on its own only with approved answers.',
    answer_retired: 'The best answer is retired from the answer library.',
  };

  /** Builds an element; children that are not nodes become text nodes. */
  function el(tag, props, ...children) {
    const e = document.createElement(tag);
    for (const [k, v] of Object.entries(props || {})) {
      if (v === undefined || v === null || v === false) continue;
      if (k === 'class') e.className = v;
      else if (k === 'text') e.textContent = v;
      else if (k.startsWith('on')) e.addEventListener(k.slice(2), v);
      else e.setAttribute(k, v === true ? '' : String(v));
    }
    for (const c of children.flat()) {
      if (c === undefined || c === null) continue;
      e.append(c instanceof Node ? c : document.createTextNode(String(c)));
    }
    return e;
  }

  function credentials() {
    try {
      return JSON.parse(sessionStorage.getItem(STORE));
    } catch (e) {
      return null;
    }
  }

  // Basic credentials are UTF-8 before base64 (RFC 7617), which btoa alone does not do.
  function basic(user, password) {
    const bytes = new TextEncoder().encode(user + ':' + password);
    let binary = '';
    bytes.forEach(b => { binary += String.fromCharCode(b); });
    return 'Basic ' + btoa(binary);
  }

  let onReady = () => {};

  /** The roles this page is for (body data-roles), or null when every role may use it. */
  function pageRoles() {
    const roles = document.body.dataset.roles;
    return roles ? roles.split(/\s+/) : null;
  }

  function showSignedIn(signedIn) {
    const c = credentials();
    const roles = pageRoles();
    const allowed = !signedIn || !c || roles === null || roles.includes(c.role);
    document.querySelectorAll('[data-when="signed-in"]').forEach(e => { e.hidden = !signedIn || !allowed; });
    document.querySelectorAll('[data-when="signed-out"]').forEach(e => { e.hidden = signedIn; });
    document.querySelectorAll('[data-when="other-role"]').forEach(e => { e.hidden = allowed; });
    document.querySelectorAll('[data-when="any-role"]').forEach(e => { e.hidden = !signedIn; });
    document.querySelectorAll('.signed-in-role').forEach(e => { e.textContent = c ? c.role : ''; });
    document.getElementById('who').textContent = signedIn && c
      ? 'Signed in as ' + c.name + ' (' + c.role + ')' : '';
    return allowed;
  }

  function signInStatus(message, isProblem) {
    const status = document.getElementById('sign-in-status');
    status.textContent = message;
    status.className = isProblem ? 'status problem' : 'status';
  }

  /** Forgets the credentials and asks for them again, saying why. */
  function needSignIn(message) {
    sessionStorage.removeItem(STORE);
    showSignedIn(false);
    signInStatus(message, true);
  }

  /**
   * Asks the service who these credentials belong to. Resolves to the stored form on success;
   * otherwise says why on the sign-in form and resolves to null.
   */
  async function check(c) {
    const r = await send('GET', '/api/v1/me', undefined, c);
    if (r.status === 200 && r.json) return { header: c.header, value: c.value, name: r.json.name, role: r.json.role };
    if (r.status === 401) {
      needSignIn(c.header === 'X-Precedent-Key'
        ? 'Not signed in: that API key is not known to this service. Check it and try again.'
        : 'Not signed in: that user name and password do not match. Check them and try again.');
    } else {
      needSignIn('Not signed in: ' + problem(r));
    }
    return null;
  }

  /** Puts the page in its signed-in state and lets it load, if this role may use it. */
  function enter(c) {
    sessionStorage.setItem(STORE, JSON.stringify(c));
    signInStatus('', false);
    if (showSignedIn(true)) onReady();
  }

  /** The sign-in form, one definition for every page: built into the page's empty #sign-in-card. */
  function buildSignIn() {
    const card = document.getElementById('sign-in-card');
    if (!card || card.firstChild) return;
    const radio = (id, value, checked, label) => [
      el('input', { type: 'radio', id, name: 'method', value, checked }),
      el('label', { for: id }, label)];
    card.append(
      el('h2', { id: 'sign-in-title' }, 'Sign in'),
      el('form', { id: 'sign-in-form', autocomplete: 'off' },
        el('fieldset', {}, el('legend', {}, 'Sign in with'),
          radio('method-key', 'key', true, 'an API key'),
          radio('method-password', 'password', false, 'a user name and password')),
        el('div', { id: 'by-key' },
          el('label', { for: 'api-key' }, 'API key'),
          el('input', { type: 'password', id: 'api-key', name: 'api-key' })),
        el('div', { id: 'by-password', class: 'row' },
          el('div', {}, el('label', { for: 'user' }, 'User name'),
            el('input', { type: 'text', id: 'user', name: 'user' })),
          el('div', {}, el('label', { for: 'password' }, 'Password'),
            el('input', { type: 'password', id: 'password', name: 'password' }))),
        el('div', { class: 'actions' },
          el('button', { type: 'submit', class: 'primary', id: 'sign-in' }, 'Sign in')),
        el('p', { class: 'hint' }, 'Kept in this browser tab only, until you sign out or close it.')),
      el('p', { id: 'sign-in-status', class: 'status', role: 'status' }));
  }

  function wireSignIn() {
    buildSignIn();
    const form = document.getElementById('sign-in-form');
    const useKey = () => form.elements['method'].value === 'key';
    const toggle = () => {
      document.getElementById('by-key').hidden = !useKey();
      document.getElementById('by-password').hidden = useKey();
    };
    form.querySelectorAll('input[name="method"]').forEach(r => r.addEventListener('change', toggle));
    toggle();
    form.addEventListener('submit', async ev => {
      ev.preventDefault();
      let c;
      if (useKey()) {
        const key = form.elements['api-key'].value.trim();
        if (!key) return needSignIn('Type your API key.');
        c = { header: 'X-Precedent-Key', value: key };
      } else {
        const user = form.elements['user'].value.trim();
        const password = form.elements['password'].value;
        if (!user || !password) return needSignIn('Type your user name and password.');
        c = { header: 'Authorization', value: basic(user, password) };
      }
      const button = document.getElementById('sign-in');
      button.disabled = true;
      signInStatus('Checking…', false);
      try {
        const checked = await check(c);
        if (!checked) return;
        // Kept for this browser tab only; closing the tab signs out.
        form.reset();
        toggle();
        enter(checked);
      } finally {
        button.disabled = false;
      }
    });
    document.querySelectorAll('.sign-out').forEach(b => b.addEventListener('click', () => {
      needSignIn('');
      signInStatus('Signed out.', false);
    }));
  }

  async function send(method, path, body, c) {
    // Marked as a script call so that the service does not make the browser show its own dialog.
    const headers = { 'Accept': 'application/json', 'X-Requested-With': 'XMLHttpRequest' };
    if (c) headers[c.header] = c.value;
    const init = { method, headers, credentials: 'omit', cache: 'no-store' };
    if (body !== undefined) {
      headers['Content-Type'] = 'application/json';
      init.body = JSON.stringify(body);
    }
    let response;
    try {
      response = await fetch(path, init);
    } catch (e) {
      return { status: 0, json: { detail: 'The service cannot be reached: ' + e.message } };
    }
    const type = response.headers.get('Content-Type') || '';
    const json = type.includes('json') ? await response.json() : null;
    return { status: response.status, json };
  }

  /**
   * Calls the API as the signed-in person. Resolves to {status, json}; a 401 sends the person back
   * to the sign-in form with the service's own explanation.
   */
  async function call(method, path, body) {
    const reply = await send(method, path, body, credentials());
    if (reply.status === 401) {
      needSignIn('Not signed in: ' + ((reply.json && reply.json.detail) || 'the service refused the credentials'));
    }
    return reply;
  }

  /** The service's own words for a failed call: detail and each named field. */
  function problem(reply) {
    const j = reply.json || {};
    const fields = (j.errors || []).map(e => e.field + ' ' + e.message).join('; ');
    return (j.detail || ('The service answered ' + reply.status)) + (fields ? ' (' + fields + ')' : '');
  }

  function setStatus(element, text, isProblem) {
    element.textContent = text;
    element.className = isProblem ? 'status problem' : 'status';
  }

  /** Figures arrive as numbers, or as "NaN" when undefined (nothing answered). */
  function num(v) {
    return typeof v === 'number' ? v : Number(v);
  }

  function percent(v, digits) {
    const n = num(v);
    return Number.isFinite(n) ? (100 * n).toFixed(digits === undefined ? 1 : digits) + '%' : 'n/a';
  }

  // Thresholds are written with the digits they have, and a confidence is cut (never rounded up)
  // to the threshold's decimals: both keep the order of the numbers, so a confidence below the
  // threshold is never written equal to or above it. The digits are those of the shortest decimal
  // that reads back as the same number (what String(n) gives), as the service writes them.

  /** A number in [0, 1] as its shortest plain decimal, without an exponent. */
  function plain(n) {
    const s = String(n);
    const e = s.indexOf('e');
    if (e < 0) return s;
    const exponent = Number(s.slice(e + 1));
    const digits = s.slice(0, e).replace('.', '');
    return exponent < 0 ? '0.' + '0'.repeat(-exponent - 1) + digits : String(Math.round(n));
  }

  function decimals(s) {
    const dot = s.indexOf('.');
    return dot < 0 ? 0 : s.length - dot - 1;
  }

  function padded(s, min) {
    const d = decimals(s);
    return d >= min ? s : (d === 0 ? s + '.' : s) + '0'.repeat(min - d);
  }

  function cut(s, d) {
    const [whole, fraction = ''] = s.split('.');
    return d === 0 ? whole : whole + '.' + (fraction + '0'.repeat(d)).slice(0, d);
  }

  /** "0.996" as "99.6%": the decimal point moves two places, no digit is lost or rounded. */
  function asPercent(s, min) {
    const [whole, fraction = ''] = s.split('.');
    const f = fraction.padEnd(2, '0');
    const int = String(Number(whole + f.slice(0, 2)));
    const rest = f.slice(2).padEnd(min, '0');
    return int + (rest ? '.' + rest : '') + '%';
  }

  /** A threshold with all of its digits, at least two decimals: 0.996 → "0.996", 0.9 → "0.90". */
  function threshold(t) {
    const n = num(t);
    if (n === Infinity || n > 1) return 'never';
    return Number.isFinite(n) ? padded(plain(n), 2) : 'n/a';
  }

  /** A confidence cut to the decimals of the threshold it is compared with. */
  function confidence(c, t) {
    const n = num(c);
    if (!Number.isFinite(n)) return 'n/a';
    const tn = num(t);
    const d = Number.isFinite(tn) && tn <= 1 ? decimals(threshold(tn)) : 2;
    return cut(plain(n), d);
  }

  /** The same two as percentages with at least one decimal: "98.2%" against "99.6%". */
  function thresholdPercent(t) {
    const n = num(t);
    if (n === Infinity || n > 1) return 'never';
    return Number.isFinite(n) ? asPercent(padded(plain(n), 3), 1) : 'n/a';
  }

  function confidencePercent(c, t) {
    const n = num(c);
    if (!Number.isFinite(n)) return 'n/a';
    const tn = num(t);
    const d = Number.isFinite(tn) && tn <= 1 ? decimals(padded(plain(tn), 3)) : 3;
    return asPercent(cut(plain(n), d), 1);
  }

  /** Wires the sign-in form and calls ready() once someone is signed in with a role this page is for. */
  function start(ready) {
    onReady = ready;
    wireSignIn();
    const c = credentials();
    showSignedIn(c !== null);
    // The stored credentials are checked again: the key may have been withdrawn since.
    if (c) check(c).then(checked => { if (checked) enter(checked); });
  }

  return { el, call, problem, setStatus, num, percent, threshold, confidence, thresholdPercent,
    confidencePercent, start, needSignIn, REASONS };
})();
