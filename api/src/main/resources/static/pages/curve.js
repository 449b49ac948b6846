'use strict';
// The risk-coverage curve as inline SVG: how many tickets get an automatic reply (coverage) against
// how many of those replies are wrong (risk), with the threshold in force, the guaranteed one and the
// chosen one marked.
const Curve = (() => {
  const NS = 'http://www.w3.org/2000/svg';
  const W = 640, H = 340, LEFT = 64, RIGHT = 18, TOP = 16, BOTTOM = 52;

  function svg(tag, attrs, text) {
    const e = document.createElementNS(NS, tag);
    for (const [k, v] of Object.entries(attrs || {})) e.setAttribute(k, String(v));
    if (text !== undefined) e.textContent = text;
    return e;
  }

  // A round top for the risk axis so that the ticks read as plain percentages.
  function riskTop(points) {
    const max = Math.max(0, ...points.map(p => Precedent.num(p.risk)).filter(Number.isFinite));
    for (const top of [0.02, 0.05, 0.1, 0.2, 0.3, 0.5, 0.75, 1]) {
      if (max <= top * 0.95) return top;
    }
    return 1;
  }

  /**
   * @param points risk-coverage points of the report
   * @param marks  [{coverage, risk, kind: 'in-force'|'recommended'|'chosen', threshold, label}]
   */
  function draw(points, marks) {
    const yTop = riskTop(points);
    const x = c => LEFT + c * (W - LEFT - RIGHT);
    const y = r => TOP + (1 - r / yTop) * (H - TOP - BOTTOM);
    const root = svg('svg', { viewBox: `0 0 ${W} ${H}`, class: 'chart', role: 'img',
      'aria-labelledby': 'curve-title', id: 'curve' });
    root.append(svg('title', { id: 'curve-title' },
      'Risk against coverage: wrong replies among automatic replies, by share answered'));
    for (let i = 0; i <= 5; i++) {
      const c = i / 5;
      root.append(svg('line', { class: 'grid', x1: x(c), x2: x(c), y1: TOP, y2: H - BOTTOM }));
      root.append(svg('text', { x: x(c), y: H - BOTTOM + 18, 'text-anchor': 'middle' }, Math.round(100 * c) + '%'));
      const r = yTop * i / 5;
      root.append(svg('line', { class: 'grid', x1: LEFT, x2: W - RIGHT, y1: y(r), y2: y(r) }));
      root.append(svg('text', { x: LEFT - 8, y: y(r) + 4, 'text-anchor': 'end' },
        (100 * r).toFixed(yTop < 0.1 ? 1 : 0) + '%'));
    }
    root.append(svg('line', { class: 'axis', x1: LEFT, x2: W - RIGHT, y1: H - BOTTOM, y2: H - BOTTOM }));
    root.append(svg('line', { class: 'axis', x1: LEFT, x2: LEFT, y1: TOP, y2: H - BOTTOM }));
    root.append(svg('text', { class: 'axis-title', x: (LEFT + W - RIGHT) / 2, y: H - 10, 'text-anchor': 'middle' },
      'Coverage: share of tickets answered automatically'));
    root.append(svg('text', { class: 'axis-title', x: 16, y: (TOP + H - BOTTOM) / 2, 'text-anchor': 'middle',
      transform: `rotate(-90 16 ${(TOP + H - BOTTOM) / 2})` }, 'Risk: share of those replies wrong'));
    const sorted = points.map(p => ({ c: Precedent.num(p.coverage), r: Precedent.num(p.risk) }))
      .filter(p => Number.isFinite(p.c) && Number.isFinite(p.r)).sort((a, b) => a.c - b.c);
    root.append(svg('polyline', { class: 'curve',
      points: sorted.map(p => x(p.c).toFixed(1) + ',' + y(Math.min(p.r, yTop)).toFixed(1)).join(' ') }));
    for (const m of marks) {
      if (!Number.isFinite(m.coverage) || !Number.isFinite(m.risk)) continue;
      const cx = x(m.coverage), cy = y(Math.min(m.risk, yTop));
      // The guaranteed threshold is a diamond, so that it reads apart from the two circles.
      const dot = m.kind === 'recommended'
        ? svg('rect', { class: m.kind, x: cx - 6, y: cy - 6, width: 12, height: 12,
          transform: `rotate(45 ${cx} ${cy})`, 'data-threshold': m.threshold })
        : svg('circle', { class: m.kind, cx, cy, r: m.kind === 'chosen' ? 6 : 8,
          'data-threshold': m.threshold });
      dot.append(svg('title', {}, m.label));
      root.append(dot);
    }
    return root;
  }

  return { draw };
})();
