'use strict';
// What both pages share: signing in, calling the API, and building DOM nodes.
// Data from the service is only ever placed with textContent / text nodes, never parsed as markup.
const Precedent = (() => {
  const STORE = 'precedent.credentials';

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

  function showSignedIn(signedIn) {
    document.querySelectorAll('[data-when="signed-in"]').forEach(e => { e.hidden = !signedIn; });
    document.querySelectorAll('[data-when="signed-out"]').forEach(e => { e.hidden = signedIn; });
    const c = credentials();
    document.getElementById('who').textContent = signedIn && c ? 'Signed in as ' + c.label : '';
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

  function wireSignIn() {
    const form = document.getElementById('sign-in-form');
    const useKey = () => form.elements['method'].value === 'key';
    const toggle = () => {
      document.getElementById('by-key').hidden = !useKey();
      document.getElementById('by-password').hidden = useKey();
    };
    form.querySelectorAll('input[name="method"]').forEach(r => r.addEventListener('change', toggle));
    toggle();
    form.addEventListener('submit', ev => {
      ev.preventDefault();
      let c;
      if (useKey()) {
        const key = form.elements['api-key'].value.trim();
        if (!key) return needSignIn('Type your API key.');
        c = { header: 'X-Precedent-Key', value: key, label: 'API key holder' };
      } else {
        const user = form.elements['user'].value.trim();
        const password = form.elements['password'].value;
        if (!user || !password) return needSignIn('Type your user name and password.');
        c = { header: 'Authorization', value: basic(user, password), label: user };
      }
      // Kept for this browser tab only; closing the tab signs out.
      sessionStorage.setItem(STORE, JSON.stringify(c));
      form.reset();
      toggle();
      signInStatus('', false);
      showSignedIn(true);
      onReady();
    });
    document.getElementById('sign-out').addEventListener('click', () => {
      needSignIn('');
      signInStatus('Signed out.', false);
    });
  }

  /**
   * Calls the API as the signed-in person. Resolves to {status, json}; a 401 sends the person back
   * to the sign-in form with the service's own explanation.
   */
  async function call(method, path, body) {
    const c = credentials();
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
    if (response.status === 401) {
      needSignIn('Not signed in: ' + ((json && json.detail) || 'the service refused the credentials'));
    }
    return { status: response.status, json };
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

  /** Wires the sign-in form and calls ready() once someone is signed in. */
  function start(ready) {
    onReady = ready;
    wireSignIn();
    const signedIn = credentials() !== null;
    showSignedIn(signedIn);
    if (signedIn) ready();
  }

  return { el, call, problem, setStatus, num, percent, start, needSignIn };
})();
