// A plan at a glance: headline numbers, the region schematic, cost by component against the rule-based plan,
// problems in plain words and what the independent checker found.

import { h, fill, errorBox, note, panel } from '../dom.js';
import { money, num, percent } from '../format.js';
import { chartBox, makeChart, colours, valueAxis } from '../charts.js';
import { planDocument, planHeader } from './plan-common.js';
import { drawSchematic, fitLabels, schematicLegend } from './schematic.js';

const components = [
  ['energyImport', 'energy bought', colours.import],
  ['energyExportCredit', 'energy sold (credit)', colours.export],
  ['demandCharge', 'demand charge', '#b97a2a'],
  ['unitStarts', 'unit starts', '#5a4a8a'],
  ['chemicals', 'chemicals', '#2c7f91'],
  ['carbon', 'carbon', '#58636d'],
  ['shortfallPenalty', 'shortfall penalty', colours.shortfall],
  ['bypassPenalty', 'bypass penalty', '#9c3b24'],
  ['permitPenalty', 'permit penalty', '#7b2d3b'],
  ['outfallPenalty', 'outfall penalty', '#a0522d'],
  ['tankEndPenalty', 'tank end penalty', '#8a6d3b'],
  ['tankLimitPenalty', 'tank limit penalty', '#6d5a3b'],
];

const statusWords = {
  optimal: 'optimal: no cheaper plan exists',
  feasible: 'feasible: a good plan, not proven best',
  noPlan: 'no plan: the solver found none in time',
};

function card(title, value, detail, kind) {
  return h('div', { class: `card ${kind ?? ''}` }, h('div', { class: 'card-title' }, title), h('div', { class: 'card-value' }, value), detail ? h('div', { class: 'card-detail' }, detail) : null);
}

function headline(summary) {
  const saving = summary.savingAgainstBaseline;
  const savingShare = summary.baselineCost ? (100 * saving) / summary.baselineCost : null;
  return h('div', { class: 'cards' },
    card('Total cost', money(summary.totalCost, summary.currency),
      `operating ${money(summary.operatingCost, summary.currency)}, penalties ${money(summary.penaltyCost, summary.currency)}`),
    card('Saving against the rule-based plan',
      saving === null || saving === undefined ? 'not computed' : money(saving, summary.currency),
      summary.baselineCost === null || summary.baselineCost === undefined ? 'no rule-based plan was costed for this solve'
        : `rule-based plan ${money(summary.baselineCost, summary.currency)}${savingShare === null ? '' : ` (${percent(savingShare, 1)} saved)`}`,
      saving > 0 ? 'good' : null),
    card('Solve', summary.status, `${statusWords[summary.status] ?? ''}; ${num(summary.solveSeconds, 1)} s${summary.gapPercent === null || summary.gapPercent === undefined ? '' : `, gap ${num(summary.gapPercent, 2)} %`}`,
      summary.status === 'noPlan' ? 'bad' : null),
    card('Independent check', summary.checkPassed ? 'passed' : `${summary.checkViolationCount} finding${summary.checkViolationCount === 1 ? '' : 's'}`,
      summary.checkPassed ? 'every balance, bound and cost recomputed without a difference' : 'see the checker\'s findings below', summary.checkPassed ? 'good' : 'bad'),
    card('Problems', String(summary.problemCount), summary.problemCount === 0 ? 'every customer served, every permit and limit kept' : 'listed below in plain words', summary.problemCount ? 'warn' : 'good'));
}

function costChart(summary) {
  const shown = components.filter(([key]) => Math.abs(summary.costs[key] ?? 0) > 0.005);
  const box = chartBox('Cost by component', `${summary.currency} over the horizon; the credit for energy sold lowers the total.`, { height: 40 + 30 * Math.max(3, shown.length), testId: 'costs' });
  const draw = () => makeChart(box.canvas, {
    type: 'bar',
    labels: shown.map(([, name]) => name),
    datasets: [{
      label: 'cost', unit: summary.currency, decimals: 2,
      data: shown.map(([key]) => (key === 'energyExportCredit' ? -summary.costs[key] : summary.costs[key])),
      backgroundColor: shown.map(([, , colour]) => colour),
    }],
    scales: {
      x: { ...valueAxis(`cost (${summary.currency})`), beginAtZero: true },
      y: { type: 'category', grid: { display: false }, ticks: { color: colours.ink }, title: { display: true, text: 'cost component', color: colours.ink } },
    },
    legend: false,
    indexAxis: 'y',
  });
  return { element: box.element, draw };
}

function comparisonChart(summary) {
  if (summary.baselineCost === null || summary.baselineCost === undefined) {
    return null;
  }
  const box = chartBox('Plan against the rule-based plan', `total cost in ${summary.currency}, penalties included`, { height: 150, testId: 'saving' });
  const draw = () => makeChart(box.canvas, {
    type: 'bar',
    labels: ['this plan', 'rule-based plan'],
    datasets: [{ label: 'total cost', unit: summary.currency, decimals: 2, data: [summary.totalCost, summary.baselineCost], backgroundColor: ['#6a43a6', '#9aa6b0'] }],
    scales: { x: { ...valueAxis(`total cost (${summary.currency})`) }, y: { type: 'category', grid: { display: false }, title: { display: true, text: 'plan', color: colours.ink } } },
    legend: false,
    indexAxis: 'y',
  });
  return { element: box.element, draw };
}

function problemList(problems) {
  if (problems.length === 0) {
    return note('No problems: every customer is served and every permit and limit is kept.', 'success');
  }
  return h('ul', { class: 'problems' }, problems.map(p => h('li', { class: `problem problem-${p.kind}` }, h('span', { class: 'kind' }, p.kind), ' ', p.message)));
}

function checkList(check) {
  if (check.passed) {
    return note('The independent checker recomputed every balance, bound, class rule, permit load and cost from the plan and the network and found nothing wrong.', 'success');
  }
  return h('div', {},
    note(`The checker found ${check.violations.length} thing${check.violations.length === 1 ? '' : 's'} to look at:`, 'warning'),
    h('ul', { class: 'problems' }, check.violations.slice(0, 50).map(v => h('li', {}, h('span', { class: 'kind' }, v.kind), ' ', v.message))));
}

export async function showOverview(view, context, planIdText) {
  const planId = Number(planIdText);
  fill(view, h('p', { class: 'hint' }, 'Loading the plan…'));
  const summary = await planDocument(planId, 'summary');
  if (!context.isCurrent()) {
    return;
  }
  const schematicBox = h('div', { class: 'schematic-box', id: 'schematic' }, h('p', { class: 'hint' }, 'Drawing the schematic…'));
  const problemsBox = h('div', {}, h('p', { class: 'hint' }, 'Loading…'));
  const checkBox = h('div', {}, h('p', { class: 'hint' }, 'Loading…'));
  const charts = [costChart(summary), comparisonChart(summary)].filter(Boolean);
  fill(view, ...planHeader(summary, ''),
    headline(summary),
    summary.notes?.length ? h('div', { class: 'message info' }, h('strong', {}, 'Notes on this solve'), h('ul', {}, summary.notes.map(n => h('li', {}, n)))) : null,
    panel('The region', schematicBox, schematicLegend()),
    h('div', { class: 'columns' },
      h('div', { class: 'half' }, panel('Cost', ...charts.map(c => c.element))),
      h('div', { class: 'half' }, panel('Problems and shortfalls', problemsBox), panel('Check', checkBox))));
  charts.forEach(c => c.draw());
  await Promise.all([
    planDocument(planId, 'schematic').then(schematic => {
      if (context.isCurrent()) {
        const svg = drawSchematic(schematic);
        fill(schematicBox, svg);
        fitLabels(svg);
      }
    }, error => fill(schematicBox, errorBox(error, 'The schematic could not be drawn'))),
    planDocument(planId, 'problems').then(p => fill(problemsBox, problemList(p.problems)), error => fill(problemsBox, errorBox(error))),
    planDocument(planId, 'check').then(c => fill(checkBox, checkList(c)), error => fill(checkBox, errorBox(error))),
  ]);
}
