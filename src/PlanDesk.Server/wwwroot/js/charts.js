// Chart.js (vendor/chartjs, loaded as the global `Chart`) with the desk's defaults: no animation, axes always
// titled with their units, tooltips that give every number with its unit, and hour axes in local time that
// show exactly the periods of each day (23 on a spring-forward day, 25 on a fall-back day).

import { h } from './dom.js';
import { num, periodTitle, clock, day } from './format.js';

const live = new Set();

export const colours = {
  ink: '#1f2a33',
  muted: '#6b7a86',
  grid: '#e3e7eb',
  outfall: '#4f7896',
  influent: '#9aa6b0',
  bypass: '#b8472f',
  import: '#d8922b',
  export: '#86a84a',
  price: '#7b2d3b',
  engine: '#2f8a5c',
  holder: '#2c7f91',
  demand: '#1f2a33',
  shortfall: '#c8433a',
  bound: '#8a96a0',
  cap: '#b8472f',
  level: '#2c6e8f',
  units: '#5a4a8a',
};

/** Reclaimed-water classes in purple, darkest for the best class. */
export function classColour(rank, classCount) {
  const ramp = ['#3d1f6b', '#6a43a6', '#9474c6', '#b9a3dc', '#d8cdee'];
  const position = classCount <= 1 ? 1 : Math.round((rank / (classCount - 1)) * (ramp.length - 1));
  return ramp[Math.min(position, ramp.length - 1)];
}

export function destroyCharts() {
  for (const chart of live) {
    chart.destroy();
  }
  live.clear();
}

/** A titled box holding one chart canvas; `caption` says in words what the chart shows. */
export function chartBox(title, caption, { height = 240, testId } = {}) {
  const canvas = h('canvas', { role: 'img', 'aria-label': `${title}. ${caption ?? ''}` });
  const element = h('figure', { class: 'chart', 'data-chart': testId ?? title },
    h('figcaption', {}, h('strong', {}, title), caption ? h('span', { class: 'caption' }, ` ${caption}`) : null),
    h('div', { class: 'chart-area', style: `height:${height}px` }, canvas));
  return { element, canvas };
}

function tooltipLabel(context) {
  const dataset = context.dataset;
  if (dataset.describe) {
    return dataset.describe(context.dataIndex);
  }
  const value = context.raw;
  if (value === null || value === undefined) {
    return `${dataset.label}: –`;
  }
  const shown = typeof value === 'object' ? value.y : value;
  return `${dataset.label}: ${num(shown, dataset.decimals ?? 1)} ${dataset.unit ?? ''}`.trimEnd();
}

// As many decimals as the tick step has (0.005 → three, 2.5 → one, 500 → none), so neighbouring ticks differ.
function tickLabel(value, index, ticks) {
  const step = ticks.length > 1 ? Math.abs(ticks[1].value - ticks[0].value) : 1;
  const decimals = Math.min(4, (String(Number(step.toPrecision(6))).split('.')[1] ?? '').length);
  return num(value, decimals, { fixed: true });
}

/** A value axis with its title (which must carry the unit). */
export function valueAxis(title, { position = 'left', stacked = false, min, max, suggestedMax, step, grid = true, grace } = {}) {
  return {
    type: 'linear', position, stacked, min, max, suggestedMax, grace, beginAtZero: true,
    title: { display: true, text: title, color: colours.ink },
    grid: { display: grid, color: colours.grid },
    ticks: { stepSize: step, callback: tickLabel, color: colours.muted },
  };
}

/** The x axis of an hourly chart: one category per period, labelled at whole hours in local time. */
export function hourAxis(periods, zone, { stacked = false } = {}) {
  const hoursShown = periods.length <= 30 ? 2 : periods.length <= 80 ? 6 : 12;
  const labelled = periods.map((p, i) => {
    const time = clock(p.localStart);
    const hour = Number(time.slice(0, 2));
    const repeated = i > 0 && clock(periods[i - 1].localStart) === time;
    if (repeated || time.slice(3) !== '00' || hour % hoursShown !== 0) {
      return '';
    }
    const firstOfDay = i === 0 || periods[i - 1].day !== p.day;
    return firstOfDay && periods.length > 30 ? [time, day(p.localStart.slice(0, 10), { year: false })] : time;
  });
  return {
    type: 'category', stacked, offset: true,
    title: { display: true, text: `local time (${zone})`, color: colours.ink },
    grid: { display: false },
    ticks: { autoSkip: false, maxRotation: 0, color: colours.muted, callback: (_, index) => labelled[index] },
  };
}

/** A chart over days: x axis labelled with the local dates. */
export function dayAxis(dates, { stacked = false } = {}) {
  return {
    type: 'category', stacked, offset: true,
    title: { display: true, text: 'local day', color: colours.ink },
    grid: { display: false },
    ticks: { color: colours.muted, maxRotation: 0 },
    labels: dates.map(d => day(d, { year: false })),
  };
}

// Dashed lines between local days on hourly charts.
const dayLines = {
  id: 'dayLines',
  afterDatasetsDraw(chart, _, options) {
    const starts = options?.starts ?? [];
    const x = chart.scales.x;
    if (!x || starts.length === 0) {
      return;
    }
    const { ctx, chartArea } = chart;
    ctx.save();
    ctx.strokeStyle = colours.bound;
    ctx.setLineDash([3, 3]);
    for (const index of starts) {
      const pixel = (x.getPixelForValue(index - 1) + x.getPixelForValue(index)) / 2;
      ctx.beginPath();
      ctx.moveTo(pixel, chartArea.top);
      ctx.lineTo(pixel, chartArea.bottom);
      ctx.stroke();
    }
    ctx.restore();
  },
};

const labelFont = '11px system-ui, sans-serif';
const labelHeight = 14;

// Where a short label goes: a box `labelHeight` high at `top`, ending 2 px inside the plot's right edge or
// starting 2 px inside its left edge.
function labelBox(ctx, chartArea, text, top, side = 'right') {
  ctx.font = labelFont;
  const width = ctx.measureText(text).width + 6;
  const left = side === 'left' ? chartArea.left + 2 : chartArea.right - width - 2;
  return { text, side, left, right: left + width, top, bottom: top + labelHeight };
}

// A short text on a white box; the box keeps the text readable where it crosses other lines, on screen and on paper.
function drawLabel(ctx, box, colour) {
  ctx.font = labelFont;
  ctx.textAlign = 'left';
  ctx.textBaseline = 'alphabetic';
  ctx.fillStyle = 'rgba(255, 255, 255, 0.9)';
  ctx.fillRect(box.left, box.top, box.right - box.left, labelHeight);
  ctx.fillStyle = colour;
  ctx.fillText(box.text, box.left + 3, box.top + labelHeight - 3);
}

// Dashed horizontal lines across the whole plot at given values (a cap at 100 %), labelled at the right end.
const guides = {
  id: 'guides',
  afterDatasetsDraw(chart, _, options) {
    const lines = options?.lines ?? [];
    const y = chart.scales.y;
    if (!y || lines.length === 0) {
      return;
    }
    const { ctx, chartArea } = chart;
    ctx.save();
    for (const guide of lines) {
      const pixel = y.getPixelForValue(guide.value);
      ctx.strokeStyle = guide.colour;
      ctx.lineWidth = 2;
      ctx.setLineDash([6, 4]);
      ctx.beginPath();
      ctx.moveTo(chartArea.left, pixel);
      ctx.lineTo(chartArea.right, pixel);
      ctx.stroke();
      ctx.setLineDash([]);
      drawLabel(ctx, labelBox(ctx, chartArea, guide.label, pixel - 17), guide.colour);
    }
    ctx.restore();
  },
};

// Whether a drawn line or dot of a dataset other than the limit lines passes through the box (pixels).
function crossesData(chart, box) {
  const hits = (top, bottom) => top <= box.bottom + 1 && bottom >= box.top - 1;
  return chart.data.datasets.some((dataset, index) => {
    const meta = chart.getDatasetMeta(index);
    if (dataset.limit || meta.type !== 'line' || !chart.isDatasetVisible(index)) {
      return false;
    }
    const points = meta.data.filter(point => !point.skip);
    if (dataset.showLine === false) {
      return points.some(p => p.x >= box.left - 4 && p.x <= box.right + 4 && hits(p.y - 4, p.y + 4));
    }
    return points.slice(1).some((b, i) => {
      const a = points[i];
      const left = Math.max(Math.min(a.x, b.x), box.left);
      const right = Math.min(Math.max(a.x, b.x), box.right);
      if (left > right) {
        return false;
      }
      const at = x => (a.x === b.x ? a.y : a.y + ((b.y - a.y) * (x - a.x)) / (b.x - a.x));
      return a.x === b.x ? hits(Math.min(a.y, b.y), Math.max(a.y, b.y)) : hits(Math.min(at(left), at(right)), Math.max(at(left), at(right)));
    });
  });
}

// Names each visible limit line (from `limitLines`) at one end of the plot, next to its line: inside the band
// between minimum and maximum, else outside it, at its own end, else at the other end, wherever it covers no
// other label and no plotted level; failing that beside the line anyway, else further inside. Labels stay in the
// plot and are drawn before the datasets, so a level passing a label stays in sight. The placed labels stay on
// the chart as `limitLabelBoxes` (pixels) for tests.
const limitLabels = {
  id: 'limitLabels',
  beforeDatasetsDraw(chart) {
    const y = chart.scales.y;
    const limits = chart.data.datasets.filter((dataset, index) => dataset.limit && chart.isDatasetVisible(index));
    const placed = [];
    chart.limitLabelBoxes = placed;
    if (!y || limits.length === 0) {
      return;
    }
    const { ctx, chartArea } = chart;
    const fits = box => box.top >= chartArea.top && box.bottom <= chartArea.bottom;
    const free = box => fits(box) && !placed.some(other => box.left < other.right && other.left < box.right && box.top < other.bottom && other.top < box.bottom);
    const labels = limits.map(dataset => {
      const { kind, value, text, side } = dataset.limit;
      const pixel = y.getPixelForValue(value);
      const inward = kind === 'max' ? 1 : -1;
      const beside = (offset, end) => labelBox(ctx, chartArea, text, offset > 0 ? pixel + offset : pixel + offset - labelHeight, end);
      const otherSide = side === 'left' ? 'right' : 'left';
      const adjacent = [side, otherSide].flatMap(end => [beside(3 * inward, end), beside(-3 * inward, end)]);
      const further = [1, 2, 3, 4, 5, 6].map(step => beside(inward * (3 + step * (labelHeight + 1)), side));
      return { dataset, pixel, adjacent, further, spots: adjacent.slice(0, 2).filter(fits).length };
    });
    // A label with one spot beside its line (a line at the plot's edge) chooses first; one with two takes the other.
    labels.sort((a, b) => a.spots - b.spots);
    ctx.save();
    for (const { dataset, pixel, adjacent, further } of labels) {
      const box = adjacent.find(c => free(c) && !crossesData(chart, c)) ?? adjacent.find(free)
        ?? further.find(c => free(c) && !crossesData(chart, c)) ?? further.find(free) ?? adjacent.find(fits) ?? adjacent[0];
      drawLabel(ctx, box, dataset.borderColor);
      placed.push({ ...box, line: pixel });
    }
    ctx.restore();
  },
};

/**
 * Draws a chart. `periods` (with their zone) makes it an hourly chart: labels are period indices and tooltips
 * show the local period. Datasets carry `unit` and `decimals` for their tooltips.
 */
export function makeChart(canvas, { type = 'bar', datasets, scales = {}, periods, zone, labels, legend = true, stacked = false, indexAxis = 'x', lines = [] }) {
  const hourly = Boolean(periods);
  const dayStarts = hourly ? periods.filter((p, i) => i > 0 && periods[i - 1].day !== p.day).map(p => p.index) : [];
  const chart = new Chart(canvas, {
    type,
    data: { labels: hourly ? periods.map(p => p.index) : labels, datasets },
    options: {
      animation: false,
      indexAxis,
      responsive: true,
      maintainAspectRatio: false,
      interaction: { mode: 'index', intersect: false },
      scales: hourly ? { x: hourAxis(periods, zone, { stacked }), ...scales } : scales,
      plugins: {
        // Limit lines are named on the plot itself, so the legend does not repeat them.
        legend: { display: legend, position: 'bottom', labels: { boxWidth: 14, color: colours.ink, filter: (item, data) => !data.datasets[item.datasetIndex]?.limit } },
        tooltip: {
          callbacks: {
            title: items => (hourly && items.length ? periodTitle(periods[items[0].dataIndex]) : items[0]?.label ?? ''),
            label: tooltipLabel,
          },
        },
        dayLines: { starts: dayStarts },
        guides: { lines },
      },
    },
    plugins: [dayLines, guides, limitLabels],
  });
  live.add(chart);
  return chart;
}

/** Step-line dataset defaults (units running, bounds). */
export function line(label, data, colour, { unit, decimals = 1, dashed = false, stepped = false, yAxisID = 'y', fill = false, width = 2 } = {}) {
  return {
    type: 'line', label, data, unit, decimals, yAxisID, stepped, fill, stack: `line:${label}`, order: 0,
    borderColor: colour, backgroundColor: colour, borderWidth: width, pointRadius: 0, pointHoverRadius: 3,
    borderDash: dashed ? [6, 4] : [],
  };
}

export function bars(label, data, colour, { unit, decimals = 1, stack, yAxisID = 'y' } = {}) {
  return { type: 'bar', label, data, unit, decimals, stack, yAxisID, backgroundColor: colour, borderWidth: 0, barPercentage: 1, categoryPercentage: 0.9, maxBarThickness: 90, order: 1 };
}

/**
 * A tank's maximum and minimum as flat dashed lines over `count` periods, each named at the plot's right end
 * ("maximum 2 000 m3", or "T1 maximum 2 000 m3" with a `name`) at the plot's right end, or its left end with
 * `side: 'left'` (to keep two tanks' labels apart). The datasets carry `limit` ({ kind, value, side, text })
 * so the label plugin and tests can find them.
 */
export function limitLines(count, { min, max, unit, decimals = 0, name = '', maxColour = colours.cap, minColour = colours.bound, side = 'right' }) {
  const limit = (kind, word, value, colour) => {
    const label = name ? `${name} ${word}` : word;
    return {
      ...line(label, Array(count).fill(value), colour, { unit, decimals, dashed: true, width: 1.5 }),
      limit: { kind, value, side, text: `${label} ${num(value, decimals)} ${unit}` },
    };
  };
  return [limit('max', 'maximum', max, maxColour), limit('min', 'minimum', min, minColour)];
}
