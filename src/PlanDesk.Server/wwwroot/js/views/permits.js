// The permit view: each plant's daily and month-to-date total N and total P loads against their caps, with
// headroom. Loads are drawn as a share of their cap so four caps read against one line at 100 %.

import { h, fill, note, panel, table } from '../dom.js';
import { day, num, qty } from '../format.js';
import { chartBox, makeChart, colours, valueAxis, dayAxis, bars } from '../charts.js';
import { planDocument, planHeader } from './plan-common.js';

const measures = [
  { name: 'total N, day', load: 'totalNitrogenKg', cap: 'dailyTotalNitrogenCapKg', colour: '#4f7896' },
  { name: 'total N, month to date', load: 'monthToDateTotalNitrogenKg', cap: 'monthlyTotalNitrogenCapKg', colour: '#9cb7cc' },
  { name: 'total P, day', load: 'totalPhosphorusKg', cap: 'dailyTotalPhosphorusCapKg', colour: '#8a6d3b' },
  { name: 'total P, month to date', load: 'monthToDateTotalPhosphorusKg', cap: 'monthlyTotalPhosphorusCapKg', colour: '#cdb98f' },
];

const capped = value => value !== null && value !== undefined && value > 0;

function headroom(load, cap) {
  return capped(cap) ? cap - load : null;
}

function loadsChart(plant, draws) {
  const days = plant.permit;
  const shown = measures.filter(m => days.some(d => capped(d[m.cap])));
  if (shown.length === 0) {
    return note('This plant\'s permit sets no total N or total P caps.');
  }
  const box = chartBox('Loads against caps', 'each load as a share of its cap; the dashed line is the cap (100 %); hover for kg.', { height: 210, testId: `permit-${plant.plantId}` });
  const datasets = shown.map(m => ({
    ...bars(m.name, days.map(d => (capped(d[m.cap]) ? (100 * d[m.load]) / d[m.cap] : null)), m.colour, { unit: '% of cap' }),
    describe: i => `${m.name}: ${qty(days[i][m.load], 'kg', 1)} of ${qty(days[i][m.cap], 'kg', 1)} cap (${num((100 * days[i][m.load]) / days[i][m.cap], 1)} %), headroom ${qty(headroom(days[i][m.load], days[i][m.cap]), 'kg', 1)}`,
  }));
  draws.push(() => makeChart(box.canvas, {
    labels: days.map(d => day(d.date, { year: false })),
    datasets,
    scales: { x: dayAxis(days.map(d => d.date)), y: valueAxis('load (% of cap)', { min: 0, suggestedMax: 110 }) },
    lines: [{ value: 100, colour: colours.cap, label: 'cap (100 %)' }],
  }));
  return box.element;
}

function permitTable(plant) {
  const rows = plant.permit.map(d => [
    day(d.date),
    qty(d.outfallM3, 'm3'),
    qty(d.totalNitrogenKg, 'kg', 1), qty(d.dailyTotalNitrogenCapKg, 'kg', 1), qty(headroom(d.totalNitrogenKg, d.dailyTotalNitrogenCapKg), 'kg', 1),
    qty(d.monthToDateTotalNitrogenKg, 'kg'), qty(headroom(d.monthToDateTotalNitrogenKg, d.monthlyTotalNitrogenCapKg), 'kg'),
    qty(d.totalPhosphorusKg, 'kg', 1), qty(d.dailyTotalPhosphorusCapKg, 'kg', 1), qty(headroom(d.totalPhosphorusKg, d.dailyTotalPhosphorusCapKg), 'kg', 1),
    qty(d.monthToDateTotalPhosphorusKg, 'kg'), qty(headroom(d.monthToDateTotalPhosphorusKg, d.monthlyTotalPhosphorusCapKg), 'kg'),
  ]);
  return table(['Day', 'Outfall', 'N load', 'N daily cap', 'N headroom', 'N month to date', 'N month headroom',
    'P load', 'P daily cap', 'P headroom', 'P month to date', 'P month headroom'], rows,
  { caption: 'Headroom is the cap minus the load (– where the permit sets no cap); a negative headroom is a breach the plan pays a penalty for. Month to date includes the loads reported before the plan.' });
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
    : panel(plant.name, h('div', { class: 'permit-row' }, loadsChart(plant, draws), h('div', { class: 'table-scroll' }, permitTable(plant)))));
  fill(view, ...planHeader(summary, '/permits'), ...sections);
  draws.forEach(draw => draw());
}
