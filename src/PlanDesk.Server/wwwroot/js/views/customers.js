// Customers over the horizon: demand, deliveries, shortfall and the marginal cost of water.

import { h, fill, note, panel, table } from '../dom.js';
import { day, num, qty, periodUnit } from '../format.js';
import { chartBox, makeChart, colours, classColour, valueAxis, dayAxis, line, bars } from '../charts.js';
import { planDocument, planHeader, chooser } from './plan-common.js';

const sum = values => values.reduce((a, b) => a + (b ?? 0), 0);

function dailyTotals(series, customer) {
  return series.days.map(d => {
    const delivered = sum(customer.deliveredM3.slice(d.firstPeriod, d.firstPeriod + d.periodCount));
    const demand = customer.demandM3 ? sum(customer.demandM3.slice(d.firstPeriod, d.firstPeriod + d.periodCount)) : customer.owedM3ByDay[d.index];
    const shortfall = customer.demandM3 ? sum(customer.shortfallM3.slice(d.firstPeriod, d.firstPeriod + d.periodCount)) : customer.shortfallM3[d.index];
    return { date: d.date, delivered, demand, shortfall };
  });
}

function hourlyChart(series, customer, colour, draws) {
  const per = periodUnit(series.periodMinutes);
  const hourly = Boolean(customer.demandM3);
  const box = chartBox('Deliveries, demand and marginal cost of water',
    `m3 ${per} delivered${hourly ? ' against the demand, with any shortfall' : ' (this customer takes a daily volume within its allowed hours)'}, and what one more m3 would cost in ${series.currency}/m3.`,
    { height: 260, testId: 'customer-hourly' });
  const datasets = [bars('delivered', customer.deliveredM3, colour, { unit: 'm3', stack: 'water' })];
  if (hourly) {
    datasets.push(bars('shortfall', customer.shortfallM3, colours.shortfall, { unit: 'm3', stack: 'water' }));
    datasets.push(line('demand', customer.demandM3, colours.demand, { unit: 'm3', dashed: true, width: 1.5, stepped: 'middle' }));
  }
  const hasCosts = customer.marginalCostPerM3.some(v => v !== null);
  if (hasCosts) {
    datasets.push({ ...line('marginal cost of water', customer.marginalCostPerM3, colours.price, { unit: `${series.currency}/m3`, decimals: 3, yAxisID: 'cost', stepped: 'middle' }), spanGaps: false });
  }
  const scales = { y: valueAxis(`water (m3 ${per})`, { stacked: true }) };
  if (hasCosts) {
    scales.cost = valueAxis(`marginal cost (${series.currency}/m3)`, { position: 'right', grid: false });
  }
  draws.push(() => makeChart(box.canvas, { datasets, periods: series.periods, zone: series.timeZone, stacked: true, scales }));
  return box.element;
}

function dailyChart(series, customer, colour, draws) {
  const totals = dailyTotals(series, customer);
  const box = chartBox('Each day: delivered and short against demand', 'm3 per local day.', { height: 200, testId: 'customer-daily' });
  draws.push(() => makeChart(box.canvas, {
    labels: totals.map(t => day(t.date, { year: false })),
    datasets: [
      bars('delivered', totals.map(t => t.delivered), colour, { unit: 'm3', decimals: 0, stack: 'water' }),
      bars('shortfall', totals.map(t => t.shortfall), colours.shortfall, { unit: 'm3', decimals: 0, stack: 'water' }),
      { ...line('demand', totals.map(t => t.demand), colours.demand, { unit: 'm3', decimals: 0, dashed: true }), pointRadius: 4, showLine: false },
    ],
    scales: { x: dayAxis(totals.map(t => t.date), { stacked: true }), y: valueAxis('water (m3 per day)', { stacked: true, grace: '8%' }) },
  }));
  return box.element;
}

function overviewTable(series) {
  const rows = series.customers.map(c => {
    const totals = dailyTotals(series, c);
    const costs = c.marginalCostPerM3.filter(v => v !== null);
    return [
      h('a', { href: `#/plan/${series.planId}/customers/${encodeURIComponent(c.customerId)}` }, c.name),
      c.kind || '–', c.classId, String(c.priority),
      qty(sum(totals.map(t => t.demand)), 'm3'), qty(sum(totals.map(t => t.delivered)), 'm3'), qty(sum(totals.map(t => t.shortfall)), 'm3'),
      costs.length ? `${num(sum(costs) / costs.length, 3, { fixed: true })} ${series.currency}/m3` : '–',
    ];
  });
  return table(['Customer', 'Kind', 'Class', 'Priority', 'Demand', 'Delivered', 'Short', 'Mean marginal cost'], rows);
}

export async function showCustomers(view, context, planIdText, customerId) {
  const planId = Number(planIdText);
  const [summary, series] = await Promise.all([planDocument(planId, 'summary'), planDocument(planId, 'series')]);
  if (!context.isCurrent()) {
    return;
  }
  const items = series.customers.map(c => ({ id: c.customerId, name: c.name }));
  const selected = customerId ?? items[0]?.id;
  const customer = series.customers.find(c => c.customerId === selected);
  const draws = [];
  const header = [...planHeader(summary, '/customers'), panel('All customers over the horizon', overviewTable(series)),
    chooser('Customer', items, selected, id => `#/plan/${planId}/customers/${encodeURIComponent(id)}`)];
  if (!customer) {
    fill(view, ...header, note(`This plan has no customer '${selected}'. Choose one above.`, 'warning'));
    return;
  }
  const info = series.classes.find(c => c.classId === customer.classId);
  const colour = classColour(info?.rank ?? 0, series.classes.length);
  fill(view, ...header,
    h('h2', { class: 'plant-title' }, `${customer.name}${customer.kind ? ` — ${customer.kind}` : ''}, needs class ${customer.classId}, priority ${customer.priority}`),
    h('div', { class: 'chart-grid' }, hourlyChart(series, customer, colour, draws), dailyChart(series, customer, colour, draws)));
  draws.forEach(draw => draw());
}
