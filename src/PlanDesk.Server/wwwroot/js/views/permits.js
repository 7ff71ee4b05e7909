// The permit view: each plant's daily and month-to-date total N and total P loads against their caps, with headroom.

import { h, fill, note, panel, table } from '../dom.js';
import { day, qty } from '../format.js';
import { chartBox, makeChart, colours, valueAxis, dayAxis, line, bars } from '../charts.js';
import { planDocument, planHeader } from './plan-common.js';

const nutrients = [
  { key: 'TotalNitrogen', name: 'total N', colour: '#4f7896' },
  { key: 'TotalPhosphorus', name: 'total P', colour: '#8a6d3b' },
];

function headroom(load, cap) {
  return cap === null || cap === undefined ? null : cap - load;
}

function nutrientChart(plant, nutrient, draws) {
  const days = plant.permit;
  const dates = days.map(d => d.date);
  const daily = days.map(d => d[`${lower(nutrient.key)}Kg`]);
  const dailyCap = days.map(d => d[`daily${nutrient.key}CapKg`]);
  const toDate = days.map(d => d[`monthToDate${nutrient.key}Kg`]);
  const monthlyCap = days.map(d => d[`monthly${nutrient.key}CapKg`]);
  const box = chartBox(`${plant.name}: ${nutrient.name}`, `kg per local day against the daily cap (left), and month to date against the monthly cap (right).`,
    { height: 220, testId: `permit-${plant.plantId}-${nutrient.name.replace(' ', '-')}` });
  const datasets = [bars(`${nutrient.name} discharged`, daily, nutrient.colour, { unit: 'kg', decimals: 1 })];
  if (dailyCap.some(v => v !== null && v !== undefined)) {
    datasets.push({ ...line('daily cap', dailyCap, colours.cap, { unit: 'kg', decimals: 1, dashed: true }), pointRadius: 3 });
  }
  const scales = { x: dayAxis(dates), y: valueAxis(`${nutrient.name} per day (kg)`) };
  if (monthlyCap.some(v => v !== null && v !== undefined)) {
    datasets.push({ ...line('month to date', toDate, colours.ink, { unit: 'kg', decimals: 0, yAxisID: 'month' }), pointRadius: 3 });
    datasets.push({ ...line('monthly cap', monthlyCap, colours.price, { unit: 'kg', decimals: 0, yAxisID: 'month', dashed: true }), pointRadius: 0 });
    scales.month = valueAxis(`${nutrient.name} month to date (kg)`, { position: 'right', grid: false });
  }
  draws.push(() => makeChart(box.canvas, { labels: dates.map(d => day(d, { year: false })), datasets, scales }));
  return box.element;
}

function lower(key) {
  return key[0].toLowerCase() + key.slice(1);
}

function permitTable(plant) {
  const rows = plant.permit.map(d => [
    day(d.date),
    qty(d.outfallM3, 'm3'),
    qty(d.totalNitrogenKg, 'kg', 1), qty(d.dailyTotalNitrogenCapKg, 'kg', 1), qty(headroom(d.totalNitrogenKg, d.dailyTotalNitrogenCapKg), 'kg', 1),
    qty(d.monthToDateTotalNitrogenKg, 'kg'), qty(headroom(d.monthToDateTotalNitrogenKg, d.monthlyTotalNitrogenCapKg), 'kg'),
    qty(d.totalPhosphorusKg, 'kg', 1), qty(d.dailyTotalPhosphorusCapKg, 'kg', 1), qty(headroom(d.totalPhosphorusKg, d.dailyTotalPhosphorusCapKg), 'kg', 1),
  ]);
  return table(['Day', 'Outfall', 'N load', 'N daily cap', 'N headroom', 'N month to date', 'N monthly headroom', 'P load', 'P daily cap', 'P headroom'], rows,
    { caption: 'Headroom is the cap minus the load; a negative headroom is a breach the plan pays a penalty for.' });
}

export async function showPermits(view, context, planIdText) {
  const planId = Number(planIdText);
  const [summary, series] = await Promise.all([planDocument(planId, 'summary'), planDocument(planId, 'series')]);
  if (!context.isCurrent()) {
    return;
  }
  const draws = [];
  const sections = series.plants.map(plant => plant.permit.length === 0
    ? panel(plant.name, note('This plan has no target sheets for this plant, so its permit loads are not available.', 'warning'))
    : panel(plant.name, h('div', { class: 'chart-grid' }, nutrients.map(n => nutrientChart(plant, n, draws))), permitTable(plant)));
  fill(view, ...planHeader(summary, '/permits'), ...sections);
  draws.forEach(draw => draw());
}
