// The region as a schematic (our own SVG): plants with their stages, tanks and reservoirs, customers, and the
// pipelines between them. Fill colour says how hard each element works (mean capacity use over the horizon);
// a red mark says a limit binds or the plan reports a problem there. Hover gives the numbers, click opens charts.

import { h } from '../dom.js';
import { num, qty } from '../format.js';
import { classColour } from '../charts.js';
import { layout, size, stageRowY } from './schematic-layout.js';

const svgNs = 'http://www.w3.org/2000/svg';
const useBins = [
  [25, '#e6edf0', 'under 25 %'],
  [50, '#b9d6df', '25–50 %'],
  [75, '#f0d78e', '50–75 %'],
  [95, '#eba35c', '75–95 %'],
  [Infinity, '#d65f45', '95 % and over'],
];
const noPlanFill = '#f1f2f4';
const limitColour = '#8e1b1b';

function s(tag, attributes = {}, ...children) {
  const element = document.createElementNS(svgNs, tag);
  for (const [name, value] of Object.entries(attributes)) {
    if (value !== null && value !== undefined) {
      element.setAttribute(name, value);
    }
  }
  for (const child of children.flat()) {
    if (child !== null && child !== undefined) {
      element.append(child instanceof Node ? child : document.createTextNode(String(child)));
    }
  }
  return element;
}

export function useColour(use) {
  return use ? useBins.find(([limit]) => use.meanPercent < limit)[1] : noPlanFill;
}

function useText(use) {
  return use ? `${num(use.meanPercent)} % mean, ${num(use.peakPercent)} % peak of ${use.basis}` : 'no plan';
}

function tooltip(lines) {
  return s('title', {}, lines.filter(Boolean).join('\n'));
}

function label(x, y, text, { maxWidth, size: fontSize = 12, weight, anchor, fill, cls } = {}) {
  return s('text', { x, y, 'font-size': fontSize, 'font-weight': weight, 'text-anchor': anchor, fill, class: cls, 'data-fit': maxWidth }, text);
}

function limitMark(x, y, count) {
  return s('g', { class: 'limit-mark' },
    s('rect', { x: x - 9, y: y - 9, width: 18, height: 18, rx: 3, fill: limitColour, transform: `rotate(45 ${x} ${y})` }),
    s('text', { x, y: y + 4, 'font-size': 11, 'font-weight': 700, 'text-anchor': 'middle', fill: '#fff' }, count > 9 ? '9+' : String(count)));
}

function classChip(x, y, classId, classes) {
  const info = classes.find(c => c.classId === classId);
  const colour = classColour(info?.rank ?? 0, classes.length);
  return s('g', {},
    s('rect', { x, y, width: 20, height: 15, rx: 3, fill: colour }),
    label(x + 10, y + 11.5, classId, { size: 10, weight: 700, anchor: 'middle', fill: (info?.rank ?? 0) / Math.max(1, classes.length - 1) > 0.6 ? '#1f2a33' : '#fff' }));
}

function plantNode(plant, box, classes, planId) {
  const marks = plant.binding.length + plant.problems.length;
  const g = s('g', { class: 'node plant', 'data-id': plant.plantId, tabindex: 0, role: 'link' },
    tooltip([plant.name, `Secondary treatment: ${useText(plant.use)}`, plant.engineUse ? `Engine: ${useText(plant.engineUse)}` : null,
      ...plant.binding.map(b => `Limit: ${b}`), ...plant.problems.map(p => `Problem: ${p}`), 'Click for this plant over time.']),
    s('rect', { x: box.x, y: box.y, width: box.width, height: box.height, rx: 7, fill: '#fff', stroke: marks ? limitColour : '#7d8a96', 'stroke-width': marks ? 2.5 : 1.2 }),
    s('path', { d: `M${box.x + 1} ${box.y + size.plantHeader} V${box.y + 7} q0 -6 6 -6 H${box.x + box.width - 7} q6 0 6 6 V${box.y + size.plantHeader} Z`, fill: useColour(plant.use) }),
    label(box.x + 10, box.y + 19, plant.name, { maxWidth: box.width - 40, weight: 700, size: 13 }),
    label(box.x + 10, box.y + 37, plant.use ? `secondary ${num(plant.use.meanPercent)} % mean · ${num(plant.use.peakPercent)} % peak` : 'no plan', { maxWidth: box.width - 20, size: 11, fill: '#33414d' }));
  if (marks) {
    g.append(limitMark(box.x + box.width - 16, box.y + 16, marks));
  }
  const rows = [...plant.stages.map(stage => ({ stage })), ...(plant.engineUse ? [{ engine: plant.engineUse }] : [])];
  rows.forEach((row, index) => {
    const y = stageRowY(box, index);
    const use = row.stage ? row.stage.use : row.engine;
    const bound = row.stage?.binding.length > 0;
    g.append(s('g', { class: row.stage ? 'stage' : 'engine', 'data-id': row.stage?.stageId ?? `${plant.plantId}-engine` },
      tooltip([row.stage ? `${row.stage.name} (class ${row.stage.classId})` : 'Biogas engine', useText(use), ...(row.stage?.binding ?? []).map(b => `Limit: ${b}`)]),
      s('rect', { x: box.x + 4, y: y + 1, width: box.width - 8, height: size.stageRow - 2, rx: 3, fill: useColour(use), stroke: bound ? limitColour : 'none', 'stroke-width': 2 }),
      row.stage ? classChip(box.x + 8, y + 3.5, row.stage.classId, classes) : null,
      label(box.x + 34, y + 15, row.stage ? row.stage.name : 'biogas engine', { maxWidth: box.width - 100, size: 11.5 }),
      label(box.x + box.width - 10, y + 15, use ? `${num(use.meanPercent)} %` : '–', { size: 11.5, anchor: 'end', weight: bound ? 700 : null, fill: bound ? limitColour : null })));
  });
  g.addEventListener('click', () => { location.hash = `#/plan/${planId}/plants/${encodeURIComponent(plant.plantId)}`; });
  return g;
}

function tankNode(tank, box, classes, planId) {
  const marks = tank.binding.length + tank.problems.length;
  const g = s('g', { class: 'node tank', 'data-id': tank.tankId, tabindex: 0, role: 'link' },
    tooltip([tank.name, tank.plantId ? null : 'Regional reservoir', `Level: ${useText(tank.use)}`,
      ...tank.binding.map(b => `Limit: ${b}`), ...tank.problems.map(p => `Problem: ${p}`)]),
    s('rect', { x: box.x, y: box.y, width: box.width, height: box.height, rx: tank.plantId ? 4 : 14, fill: useColour(tank.use),
      stroke: marks ? limitColour : '#7d8a96', 'stroke-width': marks ? 2.5 : 1.2 }),
    classChip(box.x + 8, box.y + 7, tank.classId, classes),
    label(box.x + 34, box.y + 19, tank.name, { maxWidth: box.width - (marks ? 62 : 42), size: 12, weight: 600 }),
    label(box.x + 10, box.y + 37, tank.use ? `level ${num(tank.use.meanPercent)} % mean · ${num(tank.use.peakPercent)} % peak` : 'no plan', { maxWidth: box.width - 16, size: 11, fill: '#33414d' }));
  if (marks) {
    g.append(limitMark(box.x + box.width - 15, box.y + 15, marks));
  }
  const plantId = tank.plantId;
  g.addEventListener('click', () => { location.hash = plantId ? `#/plan/${planId}/plants/${encodeURIComponent(plantId)}` : `#/plan/${planId}/plants/reservoirs`; });
  return g;
}

function customerNode(customer, box, classes, planId) {
  const short = customer.shortfallM3 > 0.5;
  const info = classes.find(c => c.classId === customer.classId);
  const g = s('g', { class: 'node customer', 'data-id': customer.customerId, tabindex: 0, role: 'link' },
    tooltip([`${customer.name}${customer.kind ? ` (${customer.kind})` : ''}, needs class ${customer.classId}`,
      `Demand ${qty(customer.demandM3, 'm3')}, delivered ${qty(customer.deliveredM3, 'm3')}, short ${qty(customer.shortfallM3, 'm3')}`,
      ...customer.problems.map(p => `Problem: ${p}`), 'Click for this customer over time.']),
    s('rect', { x: box.x, y: box.y, width: box.width, height: box.height, rx: 4, fill: '#fff', stroke: short ? limitColour : '#7d8a96', 'stroke-width': short ? 2.5 : 1.2 }),
    s('rect', { x: box.x, y: box.y, width: 6, height: box.height, fill: classColour(info?.rank ?? 0, classes.length) }),
    label(box.x + 14, box.y + 19, customer.name, { maxWidth: box.width - (short ? 44 : 22), size: 12, weight: 600 }),
    label(box.x + 14, box.y + 37, short ? `short ${qty(customer.shortfallM3, 'm3')} of ${qty(customer.demandM3, 'm3')}` : `${qty(customer.deliveredM3, 'm3')} delivered`,
      { maxWidth: box.width - 22, size: 11, fill: short ? limitColour : '#33414d', weight: short ? 700 : null }));
  if (short) {
    g.append(limitMark(box.x + box.width - 15, box.y + 15, customer.problems.length || 1));
  }
  g.addEventListener('click', () => { location.hash = `#/plan/${planId}/customers/${encodeURIComponent(customer.customerId)}`; });
  return g;
}

function link(from, to, { colour, width, dashed, title, bound }) {
  const bend = Math.max(30, (to.x - from.x) / 2);
  const d = `M${from.x} ${from.y} C${from.x + bend} ${from.y}, ${to.x - bend} ${to.y}, ${to.x} ${to.y}`;
  const midX = (from.x + to.x) / 2;
  const midY = (from.y + to.y) / 2;
  return s('g', { class: 'link' },
    tooltip(title),
    s('path', { d, fill: 'none', stroke: '#fff', 'stroke-width': width + 3 }),
    s('path', { d, fill: 'none', stroke: colour, 'stroke-width': width, 'stroke-dasharray': dashed ? '5 4' : null }),
    bound ? s('circle', { cx: midX, cy: midY, r: 5, fill: limitColour, stroke: '#fff', 'stroke-width': 1.5 }) : null);
}

function links(schematic, boxes) {
  const drawn = [];
  for (const plant of schematic.plants) {
    const box = boxes.get(`plant:${plant.plantId}`);
    plant.stages.forEach((stage, index) => {
      const y = stageRowY(box, index) + size.stageRow / 2;
      const product = boxes.get(`tank:${stage.productTankId}`);
      if (product) {
        drawn.push(link({ x: box.x + box.width, y }, { x: product.x, y: product.y + product.height / 2 },
          { colour: '#7d8a96', width: 1.5, title: [`${stage.name} → tank ${stage.productTankId}`] }));
      }
      const feed = stage.feedTankId ? boxes.get(`tank:${stage.feedTankId}`) : null;
      if (feed) {
        drawn.push(link({ x: feed.x, y: feed.y + feed.height - 8 }, { x: box.x + box.width, y: y + 4 },
          { colour: '#7d8a96', width: 1.5, dashed: true, title: [`${stage.name} is fed from tank ${stage.feedTankId}`] }));
      }
    });
  }
  for (const pipe of schematic.pipelines) {
    const from = boxes.get(`tank:${pipe.fromTankId}`);
    const to = boxes.get(`${pipe.toKind}:${pipe.toId}`);
    if (!from || !to) {
      continue;
    }
    const bound = pipe.binding.length > 0;
    drawn.push(link({ x: from.x + from.width, y: from.y + from.height / 2 }, { x: to.x, y: to.y + to.height / 2 }, {
      colour: pipe.use ? shade(useColour(pipe.use)) : '#aab4bd',
      width: pipe.use ? 2 + 4 * Math.min(1, pipe.use.meanPercent / 100) : 2,
      bound,
      title: [pipe.name, `Flow: ${useText(pipe.use)}`, ...pipe.binding.map(b => `Limit: ${b}`)],
    }));
  }
  return drawn;
}

// Pipelines use the same scale as the boxes, a little darker so thin lines stay visible on white.
function shade(colour) {
  const value = parseInt(colour.slice(1), 16);
  const channel = shift => Math.round(((value >> shift) & 255) * 0.78);
  return `rgb(${channel(16)}, ${channel(8)}, ${channel(0)})`;
}

/** Shortens labels with an ellipsis until they fit their box; must run once the drawing is in the page. */
export function fitLabels(svg) {
  for (const text of svg.querySelectorAll('text[data-fit]')) {
    const max = Number(text.getAttribute('data-fit'));
    const full = text.textContent;
    let kept = full.length;
    while (kept > 1 && text.getComputedTextLength() > max) {
      kept--;
      text.textContent = `${full.slice(0, kept).trimEnd()}…`;
    }
  }
}

export function schematicLegend() {
  return h('div', { class: 'legend' },
    h('span', { class: 'legend-title' }, 'Capacity use (mean over the horizon):'),
    useBins.map(([, colour, text]) => h('span', { class: 'legend-item' }, h('span', { class: 'swatch', style: `background:${colour}` }), text)),
    h('span', { class: 'legend-item' }, h('span', { class: 'swatch limit' }), 'a limit binds or a problem is reported (hover for words)'),
    h('span', { class: 'legend-item' }, 'Line width: pipeline flow; dashed: a stage fed from a tank.'));
}

/** The SVG of the schematic; call fitLabels on it once it is in the page. */
export function drawSchematic(schematic) {
  const { boxes, width, height } = layout(schematic);
  const svg = s('svg', {
    class: 'schematic', viewBox: `0 0 ${width} ${height}`, width: '100%', role: 'img',
    'aria-label': `Schematic of ${schematic.networkName}: ${schematic.plants.length} plants, ${schematic.tanks.length} tanks, ${schematic.customers.length} customers`,
    style: `max-width:${Math.max(width, 900)}px`,
  });
  svg.append(...links(schematic, boxes));
  for (const plant of schematic.plants) {
    svg.append(plantNode(plant, boxes.get(`plant:${plant.plantId}`), schematic.classes, schematic.planId));
  }
  for (const tank of schematic.tanks) {
    svg.append(tankNode(tank, boxes.get(`tank:${tank.tankId}`), schematic.classes, schematic.planId));
  }
  for (const customer of schematic.customers) {
    svg.append(customerNode(customer, boxes.get(`customer:${customer.customerId}`), schematic.classes, schematic.planId));
  }
  return svg;
}
