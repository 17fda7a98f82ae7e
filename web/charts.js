// Charts as inline SVG built from DOM nodes (no chart library): annual cost
// (energy and fixed stacked), cost against one price with break-even points,
// heat-pump performance over temperature bins, bills against degree-days with
// the fitted line, a tornado of the winner's lead, the probability of being
// cheapest and uncertainty ranges. Each chart's numbers are also listed as
// buttons beside it (views/verdict.js), so every value can be tapped.
import { s } from './dom.js';

export const PALETTE = ['#1f5aa6', '#b35900', '#2c7a3f', '#7b3fa0', '#b3261e', '#00696b', '#6d4c2f', '#3d4a5c'];
const DASHES = ['', '6 3', '2 3', '8 3 2 3', '1 2', '10 4'];
const INK = '#1b2433';
const MUTED = '#4f5b6b';
const GRID = '#d5dbe3';

function niceTicks(min, max, count = 5) {
  if (!(max > min)) return [min];
  const raw = (max - min) / count;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * mag).find((st) => st >= raw) ?? raw;
  const ticks = [];
  for (let v = Math.floor(min / step + 1e-9) * step; v <= max + step * 1e-9; v += step) ticks.push(Number(v.toPrecision(12)));
  if (ticks.at(-1) < max) ticks.push(Number((ticks.at(-1) + step).toPrecision(12)));
  return ticks;
}

function frame(width, height, label) {
  return s('svg', { viewBox: `0 0 ${width} ${height}`, width: '100%', role: 'img', 'aria-label': label,
    class: 'chart', preserveAspectRatio: 'xMidYMid meet' }, s('title', { text: label }));
}

const text = (x, y, content, props = {}) => s('text', { x, y, fill: INK, 'font-size': 13, ...props, text: content });

/** A label on at most two lines of about `width` characters, broken at spaces (cut with … only beyond two lines). */
export function labelLines(label, width) {
  if (label.length <= width) return [label];
  const cut = label.lastIndexOf(' ', width);
  const first = cut > 0 ? label.slice(0, cut) : label.slice(0, width);
  const rest = label.slice(first.length).trim();
  return [first, rest.length > width ? `${rest.slice(0, width - 1)}…` : rest];
}

/** Horizontal stacked bars of annual cost: rows [{id, label, energy, fixed}]. */
export function costBars(rows, { money, title = 'Annual cost' }) {
  const width = 640;
  const labelW = 250;
  const barH = 26;
  const gap = 12;
  const top = 34;
  const height = top + rows.length * (barH + gap) + 30;
  const max = Math.max(1, ...rows.map((r) => r.energy + r.fixed));
  const ticks = niceTicks(0, max, 4);
  const right = width - 80;
  const x = (v) => labelW + (v / Math.max(max, ticks.at(-1))) * (right - labelW);
  const svg = frame(width, height, title);
  svg.append(
    s('rect', { x: labelW, y: 8, width: 14, height: 14, fill: PALETTE[0] }), text(labelW + 20, 20, 'energy'),
    s('rect', { x: labelW + 90, y: 8, width: 14, height: 14, fill: '#9fb8d9', stroke: PALETTE[0] }), text(labelW + 110, 20, 'fixed charges'));
  for (const t of ticks) {
    svg.append(s('line', { x1: x(t), x2: x(t), y1: top - 4, y2: height - 24, stroke: GRID }),
      text(x(t), height - 8, money(t), { 'text-anchor': 'middle', fill: MUTED, 'font-size': 11 }));
  }
  rows.forEach((row, i) => {
    const y = top + i * (barH + gap);
    const lines = labelLines(row.label, 30);
    const label = text(labelW - 8, y + barH / 2 + 5 - (lines.length - 1) * 7, '', { 'text-anchor': 'end', 'font-size': lines.length > 1 ? 12 : 13 });
    lines.forEach((line, k) => label.append(s('tspan', { x: labelW - 8, dy: k ? 14 : 0, text: line })));
    svg.append(label);
    svg.append(s('rect', { x: labelW, y, width: Math.max(0, x(row.energy) - labelW), height: barH, fill: PALETTE[0], dataset: { id: row.id, part: 'energy' } }));
    svg.append(s('rect', { x: x(row.energy), y, width: Math.max(0, x(row.energy + row.fixed) - x(row.energy)), height: barH,
      fill: '#9fb8d9', stroke: PALETTE[0], dataset: { id: row.id, part: 'fixed' } }));
    svg.append(text(x(row.energy + row.fixed) + 6, y + barH / 2 + 5, money(row.energy + row.fixed), { 'font-weight': 600 }));
  });
  return svg;
}

/**
 * Lines of annual cost against one price. series [{id, label, points: [[price, cost]], swept}],
 * marks [{x, y, label}] (break-even points), current (the price now).
 */
export function priceLines(series, { marks = [], current, formatX, money, xLabel, title }) {
  const width = 640;
  const height = 360;
  const left = 70;
  const right = 20;
  const top = 20;
  const bottom = 54;
  const xs = series.flatMap((sr) => sr.points.map((p) => p[0]));
  const ys = series.flatMap((sr) => sr.points.map((p) => p[1]));
  const x0 = Math.min(...xs);
  const x1 = Math.max(...xs);
  const yTicks = niceTicks(0, Math.max(1, ...ys), 5);
  const y1 = yTicks.at(-1);
  const X = (v) => left + ((v - x0) / (x1 - x0 || 1)) * (width - left - right);
  const Y = (v) => top + (1 - v / (y1 || 1)) * (height - top - bottom);
  const svg = frame(width, height, title);
  for (const t of yTicks) {
    svg.append(s('line', { x1: left, x2: width - right, y1: Y(t), y2: Y(t), stroke: GRID }),
      text(left - 6, Y(t) + 4, money(t), { 'text-anchor': 'end', fill: MUTED, 'font-size': 11 }));
  }
  for (const t of niceTicks(x0, x1, 5).filter((v) => v >= x0 - 1e-9 && v <= x1 + 1e-9)) {
    svg.append(text(X(t), height - bottom + 16, formatX(t), { 'text-anchor': 'middle', fill: MUTED, 'font-size': 11 }));
  }
  svg.append(text((left + width - right) / 2, height - 12, xLabel, { 'text-anchor': 'middle', fill: MUTED }));
  if (Number.isFinite(current)) {
    svg.append(s('line', { x1: X(current), x2: X(current), y1: top, y2: height - bottom, stroke: MUTED, 'stroke-dasharray': '3 3' }),
      text(X(current) + 4, top + 12, 'now', { fill: MUTED, 'font-size': 11 }));
  }
  series.forEach((sr, i) => {
    const d = sr.points.map((p, k) => `${k ? 'L' : 'M'}${X(p[0]).toFixed(1)},${Y(p[1]).toFixed(1)}`).join(' ');
    svg.append(s('path', { d, fill: 'none', stroke: PALETTE[i % PALETTE.length], 'stroke-width': sr.swept ? 3.5 : 2,
      'stroke-dasharray': DASHES[i % DASHES.length] || undefined, dataset: { id: sr.id } }));
  });
  for (const mark of marks) {
    svg.append(s('circle', { cx: X(mark.x), cy: Y(mark.y), r: 6, fill: '#fff', stroke: INK, 'stroke-width': 2, class: 'break-even',
      dataset: { value: String(mark.x), with: mark.with ?? '' } }, s('title', { text: mark.label })));
  }
  return svg;
}

/**
 * Heat-pump performance over temperature bins: the house's load and the heat
 * pump's capacity [kW] on the left scale, COP on the right, hours per year as
 * grey bars; the heat the backup supplies is shaded (between capacity and load,
 * or the whole load where the heat pump is off).
 */
export function binsChart(bins, { tempLabel, toTemp, title, number, powerLabel = 'kW', kwTo = 1 }) {
  // load and capacity in the unit the quote speaks (`kwTo` per kW, e.g. Btu/h on a US quote)
  bins = bins.map((b) => ({ ...b, load_kw: (b.load_kw ?? 0) * kwTo, capacity_kw: b.capacity_kw === undefined ? undefined : b.capacity_kw * kwTo }));
  const width = 640;
  const height = 340;
  const left = 56;
  const right = 56;
  const top = 44;
  const bottom = 48;
  const ts = bins.map((b) => toTemp(b.t));
  const t0 = Math.min(...ts);
  const t1 = Math.max(...ts);
  const kw = Math.max(kwTo, ...bins.flatMap((b) => [b.load_kw ?? 0, b.off ? 0 : b.capacity_kw ?? 0]));
  const kTicks = niceTicks(0, kw, 4);
  const kMax = kTicks.at(-1);
  const hours = Math.max(1, ...bins.map((b) => b.hours ?? 0));
  const copMax = Math.max(1, ...bins.map((b) => b.cop ?? 0)) * 1.1;
  const X = (t) => left + ((t - t0) / (t1 - t0 || 1)) * (width - left - right);
  const Y = (v, max) => top + (1 - Math.min(v, max) / max) * (height - top - bottom);
  const svg = frame(width, height, title);
  const step = bins.length > 1 ? Math.abs(X(ts[1]) - X(ts[0])) : (width - left - right);
  const barW = Math.max(2, step * 0.7);
  bins.forEach((b, i) => {
    svg.append(s('rect', { x: X(ts[i]) - barW / 2, y: Y(b.hours ?? 0, hours), width: barW, height: Y(0, hours) - Y(b.hours ?? 0, hours), fill: '#e3e9f1' }));
  });
  // backup heat: where the load is above what the heat pump gives (or it is off)
  bins.forEach((b, i) => {
    if (!(b.backup_heat_kwh > 0)) return;
    const upper = b.load_kw ?? 0;
    const lower = b.off ? 0 : Math.min(upper, b.capacity_kw ?? 0);
    svg.append(s('rect', { x: X(ts[i]) - step / 2, y: Y(upper, kMax), width: step, height: Math.max(0, Y(lower, kMax) - Y(upper, kMax)),
      fill: 'rgb(179 38 30 / 0.22)', class: b.off ? 'backup off' : 'backup', dataset: { t: String(b.t) } }));
  });
  for (const t of kTicks) {
    svg.append(s('line', { x1: left, x2: width - right, y1: Y(t, kMax), y2: Y(t, kMax), stroke: GRID }),
      text(left - 6, Y(t, kMax) + 4, number(t), { 'text-anchor': 'end', fill: MUTED, 'font-size': 11 }));
  }
  for (const t of niceTicks(t0, t1, 6).filter((v) => v >= t0 - 1e-9 && v <= t1 + 1e-9)) svg.append(text(X(t), height - bottom + 16, number(t), { 'text-anchor': 'middle', fill: MUTED, 'font-size': 11 }));
  svg.append(text((left + width - right) / 2, height - 10, `outdoor temperature (${tempLabel}); grey bars: hours per year`, { 'text-anchor': 'middle', fill: MUTED, 'font-size': 12 }));
  const line = (value, max, color, dash, cls) => {
    const d = bins.map((b, i) => `${i ? 'L' : 'M'}${X(ts[i]).toFixed(1)},${Y(value(b) ?? 0, max).toFixed(1)}`).join(' ');
    svg.append(s('path', { d, fill: 'none', stroke: color, 'stroke-width': 2.5, 'stroke-dasharray': dash || undefined, class: cls }));
  };
  line((b) => b.load_kw, kMax, PALETTE[4], '', 'load');
  line((b) => (b.off ? 0 : b.capacity_kw), kMax, PALETTE[0], '6 3', 'capacity');
  line((b) => (b.off ? null : b.cop), copMax, PALETTE[2], '2 3', 'cop');
  svg.append(text(left, 14, `${powerLabel}: load (solid red), heat-pump capacity (dashed blue); COP (dotted green, right scale)`, { fill: MUTED, 'font-size': 12 }));
  svg.append(s('rect', { x: left, y: 22, width: 14, height: 12, fill: 'rgb(179 38 30 / 0.22)' }),
    text(left + 20, 33, 'heat from the backup', { fill: MUTED, 'font-size': 12 }));
  for (const t of niceTicks(0, copMax, 4)) {
    if (t > copMax) continue;
    svg.append(text(width - right + 6, Y(t, copMax) + 4, number(t), { fill: PALETTE[2], 'font-size': 11 }));
  }
  return svg;
}

/**
 * Bills against the weather: use per day over heating degree-days per day,
 * one dot per bill, and the fitted line use = base + slope x HDD.
 */
export function billsChart(points, { base, slope, xLabel, yLabel, number, title }) {
  const width = 640;
  const height = 320;
  const left = 64;
  const right = 20;
  const top = 20;
  const bottom = 50;
  const xs = points.map((p) => p.hdd_per_day);
  const ys = points.map((p) => p.use_per_day);
  const xTicks = niceTicks(0, Math.max(1, ...xs), 5);
  const x1 = xTicks.at(-1);
  const fitTop = base + slope * x1;
  const yTicks = niceTicks(0, Math.max(1, ...ys, Number.isFinite(fitTop) ? fitTop : 0), 5);
  const y1 = yTicks.at(-1);
  const X = (v) => left + (v / (x1 || 1)) * (width - left - right);
  const Y = (v) => top + (1 - v / (y1 || 1)) * (height - top - bottom);
  const svg = frame(width, height, title);
  for (const t of yTicks) {
    svg.append(s('line', { x1: left, x2: width - right, y1: Y(t), y2: Y(t), stroke: GRID }),
      text(left - 6, Y(t) + 4, number(t), { 'text-anchor': 'end', fill: MUTED, 'font-size': 11 }));
  }
  for (const t of xTicks) svg.append(text(X(t), height - bottom + 16, number(t), { 'text-anchor': 'middle', fill: MUTED, 'font-size': 11 }));
  svg.append(text((left + width - right) / 2, height - 12, xLabel, { 'text-anchor': 'middle', fill: MUTED }));
  svg.append(text(left, 12, yLabel, { fill: MUTED, 'font-size': 12 }));
  if (Number.isFinite(base) && Number.isFinite(slope)) {
    svg.append(s('line', { x1: X(0), y1: Y(base), x2: X(x1), y2: Y(fitTop), stroke: PALETTE[0], 'stroke-width': 2.5, class: 'fit' }));
  }
  points.forEach((p, i) => {
    svg.append(s('circle', { cx: X(p.hdd_per_day), cy: Y(p.use_per_day), r: 5.5, fill: PALETTE[1], stroke: '#fff', 'stroke-width': 1.5,
      class: 'bill', dataset: { i: String(i) } }, s('title', { text: `${number(p.hdd_per_day)} degree-days a day: ${number(p.use_per_day)} a day` })));
  });
  return svg;
}

/**
 * Tornado: how the winner's lead over the runner-up moves when one input goes
 * down or up (rows [{label, low, high}] as margins, sorted by swing); `margin` is today's lead.
 */
export function tornadoChart(rows, { margin, money, title, lowLabel = '−', highLabel = '+' }) {
  const width = 640;
  const labelW = 250;
  const rowH = 30;
  const top = 30;
  const height = top + rows.length * rowH + 56;
  const values = rows.flatMap((r) => [r.low, r.high]).concat([margin, 0]);
  const ticks = niceTicks(Math.min(...values), Math.max(...values), 4);
  const lo = ticks[0];
  const hi = ticks.at(-1);
  const X = (v) => labelW + ((v - lo) / (hi - lo || 1)) * (width - labelW - 20);
  const svg = frame(width, height, title);
  for (const t of ticks) {
    svg.append(s('line', { x1: X(t), x2: X(t), y1: top - 6, y2: height - 50, stroke: GRID }),
      text(X(t), height - 34, money(t), { 'text-anchor': 'middle', fill: MUTED, 'font-size': 11 }));
  }
  svg.append(s('line', { x1: X(0), x2: X(0), y1: top - 10, y2: height - 50, stroke: INK, 'stroke-width': 1.5 }),
    s('line', { x1: X(margin), x2: X(margin), y1: top - 10, y2: height - 50, stroke: MUTED, 'stroke-dasharray': '4 3' }),
    text(X(margin) + 4, top - 14, 'lead today', { fill: MUTED, 'font-size': 11 }),
    text(X(0) - 4, top - 14, 'tie', { fill: INK, 'font-size': 11, 'text-anchor': 'end' }));
  rows.forEach((r, i) => {
    const y = top + i * rowH;
    const label = r.label.length > 34 ? `${r.label.slice(0, 33)}…` : r.label;
    svg.append(text(labelW - 8, y + rowH / 2 + 4, label, { 'text-anchor': 'end', 'font-size': 12 }));
    const bar = (value, color, name) => {
      const a = Math.min(X(margin), X(value));
      const w = Math.abs(X(value) - X(margin));
      svg.append(s('rect', { x: a, y: y + 5, width: Math.max(1, w), height: rowH - 10, fill: color, class: `tornado-${name}`, dataset: { value: String(value) } }));
    };
    bar(r.low, '#9fb8d9', 'low');
    bar(r.high, PALETTE[1], 'high');
  });
  const ly = height - 16;
  svg.append(s('rect', { x: labelW, y: ly - 10, width: 12, height: 12, fill: '#9fb8d9' }), text(labelW + 16, ly, lowLabel, { 'font-size': 11, fill: MUTED }),
    s('rect', { x: labelW + 150, y: ly - 10, width: 12, height: 12, fill: PALETTE[1] }), text(labelW + 166, ly, highLabel, { 'font-size': 11, fill: MUTED }));
  return svg;
}

/** Probability of being cheapest, one bar per option: rows [{label, p}] with p in 0..1. */
export function probabilityBars(rows, { percent, title }) {
  const width = 640;
  const labelW = 250;
  const rowH = 30;
  const height = 12 + rows.length * rowH + 12;
  const X = (p) => labelW + p * (width - labelW - 70);
  const svg = frame(width, height, title);
  rows.forEach((r, i) => {
    const y = 12 + i * rowH;
    const label = r.label.length > 34 ? `${r.label.slice(0, 33)}…` : r.label;
    svg.append(text(labelW - 8, y + rowH / 2 + 4, label, { 'text-anchor': 'end', 'font-size': 12 }),
      s('rect', { x: labelW, y: y + 5, width: X(1) - labelW, height: rowH - 10, fill: '#eef1f5' }),
      s('rect', { x: labelW, y: y + 5, width: Math.max(0, X(r.p) - labelW), height: rowH - 10, fill: PALETTE[i % PALETTE.length], class: 'p-cheapest',
        dataset: { value: String(r.p) } }),
      text(X(1) + 8, y + rowH / 2 + 4, percent(r.p), { 'font-size': 12, 'font-weight': 600 }));
  });
  return svg;
}

/** Ranges p10–p90 with p50 per option: rows [{label, p10, p50, p90, note}]. */
export function rangeChart(rows, { money, title }) {
  const width = 640;
  const labelW = 210;
  const rowH = 34;
  const top = 16;
  const height = top + rows.length * rowH + 30;
  const max = Math.max(1, ...rows.map((r) => r.p90));
  const min = Math.min(...rows.map((r) => r.p10));
  const ticks = niceTicks(Math.max(0, min * 0.9), max, 4);
  const lo = ticks[0];
  const hi = ticks.at(-1);
  const X = (v) => labelW + ((v - lo) / (hi - lo || 1)) * (width - labelW - 70);
  const svg = frame(width, height, title);
  for (const t of ticks) svg.append(s('line', { x1: X(t), x2: X(t), y1: top, y2: height - 24, stroke: GRID }),
    text(X(t), height - 8, money(t), { 'text-anchor': 'middle', fill: MUTED, 'font-size': 11 }));
  rows.forEach((r, i) => {
    const y = top + i * rowH + rowH / 2;
    svg.append(text(labelW - 8, y + 5, r.label.length > 30 ? `${r.label.slice(0, 29)}…` : r.label, { 'text-anchor': 'end' }),
      s('line', { x1: X(r.p10), x2: X(r.p90), y1: y, y2: y, stroke: PALETTE[i % PALETTE.length], 'stroke-width': 8, 'stroke-linecap': 'round' }),
      s('line', { x1: X(r.p50), x2: X(r.p50), y1: y - 10, y2: y + 10, stroke: INK, 'stroke-width': 2.5 }),
      text(X(r.p90) + 10, y + 5, r.note ?? '', { 'font-size': 12, fill: MUTED }));
  });
  return svg;
}
