// What every view of one plan shares: the tabs, and the plan's documents fetched once per page visit.

import { h } from '../dom.js';
import { api } from '../api.js';
import { day } from '../format.js';

const cache = new Map();

/** Fetches a plan document once (summary, schematic, series, problems, check ...). Failed fetches are not kept. */
// The service answers /summary with the plan's identity, its check verdict and notes beside the solve
// summary itself; the views read one flat headline.
function headlineOf(response) {
  const summary = response.summary;
  const costs = summary.costs;
  const baseline = summary.baselineCost ?? null;
  return {
    ...response,
    currency: summary.currency,
    status: summary.status,
    solveSeconds: summary.solveSeconds,
    gapPercent: summary.gapPercent ?? null,
    costs,
    totalCost: costs.total,
    operatingCost: costs.operating,
    penaltyCost: costs.penalties,
    baselineCost: baseline,
    savingAgainstBaseline: baseline === null ? null : baseline - costs.total,
    checkViolationCount: summary.checkViolations ?? 0,
    problemCount: summary.problems.length,
  };
}

export function planDocument(planId, name) {
  const key = `${planId}/${name}`;
  if (!cache.has(key)) {
    const path = name === 'plan' ? `/api/plans/${planId}` : `/api/plans/${planId}/${name}`;
    const pending = name === 'summary' ? api(path).then(headlineOf) : api(path);
    pending.catch(() => cache.delete(key));
    cache.set(key, pending);
  }
  return cache.get(key);
}

/** Forget what was fetched about a plan (after publishing, previews change). */
export function forget(planId, name) {
  cache.delete(`${planId}/${name}`);
}

const tabs = [
  ['', 'Overview'],
  ['/plants', 'Plants over time'],
  ['/customers', 'Customers'],
  ['/permits', 'Permits'],
  ['/publish', 'Publish'],
];

/** The heading and tabs of a plan's pages. */
export function planHeader(summary, active) {
  const title = summary
    ? `Plan ${summary.planId}: ${summary.networkName}, ${summary.days} day${summary.days > 1 ? 's' : ''} from ${day(summary.startDate)}`
    : 'Plan';
  return [
    h('p', {}, h('a', { href: '#/plans' }, '← Plans and solves')),
    h('h1', {}, title),
    h('nav', { class: 'tabs', 'aria-label': 'Plan views' },
      tabs.map(([path, label]) => h('a', {
        href: `#/plan/${summary?.planId}${path}`,
        class: path === active ? 'active' : null,
        'aria-current': path === active ? 'page' : null,
      }, label))),
  ];
}

/** A chooser of one item (plant, customer) that changes the address. */
export function chooser(label, items, selected, hrefOf) {
  return h('nav', { class: 'chooser', 'aria-label': label },
    h('span', { class: 'chooser-label' }, `${label}:`),
    items.map(item => h('a', {
      href: hrefOf(item.id),
      class: item.id === selected ? 'active' : null,
      'aria-current': item.id === selected ? 'page' : null,
    }, item.name)));
}
