// The desk's entry point: restores the tab's session, draws the header for the key's role and shows the view
// the address names (#/plans, #/plan/12, #/plant/larkmoor/2027-03-26 ...).

import { h, fill, errorBox, note } from './dom.js';
import { restore, currentSession, signOut, can } from './session.js';
import { destroyCharts } from './charts.js';
import { showSignIn } from './views/signin.js';
import { showPlans } from './views/plans.js';
import { showJob } from './views/job.js';
import { showOverview } from './views/overview.js';
import { showPlantCharts } from './views/plant-charts.js';
import { showCustomers } from './views/customers.js';
import { showPermits } from './views/permits.js';
import { showPublish } from './views/publish.js';
import { showPlantDesk } from './views/plant-desk.js';

const routes = [
  [/^#\/plans$/, showPlans],
  [/^#\/jobs\/(\d+)$/, showJob],
  [/^#\/plan\/(\d+)$/, showOverview],
  [/^#\/plan\/(\d+)\/plants(?:\/([^/]+))?$/, showPlantCharts],
  [/^#\/plan\/(\d+)\/customers(?:\/([^/]+))?$/, showCustomers],
  [/^#\/plan\/(\d+)\/permits$/, showPermits],
  [/^#\/plan\/(\d+)\/publish$/, showPublish],
  [/^#\/plant\/([^/]+)(?:\/(\d{4}-\d{2}-\d{2}))?$/, showPlantDesk],
];

let generation = 0;

function home() {
  const session = currentSession();
  return session?.role === 'plant' ? `#/plant/${encodeURIComponent(session.plant.plantId)}` : '#/plans';
}

function drawHeader() {
  const session = currentSession();
  const nav = document.getElementById('nav');
  const who = document.getElementById('who');
  if (!session) {
    fill(nav);
    fill(who);
    return;
  }
  const links = can.readPlans()
    ? [h('a', { href: '#/plans' }, 'Plans and solves')]
    : [h('a', { href: home() }, `Plant: ${session.plant?.name ?? session.plant?.plantId}`)];
  fill(nav, ...links);
  const roleText = session.role === 'plant' ? `plant key (${session.plant?.plantId})` : `${session.role} key`;
  fill(who,
    h('span', { class: `role role-${session.role}`, title: `Key ${session.keyId}${session.label ? ` — ${session.label}` : ''}` }, roleText),
    h('button', { type: 'button', class: 'link', onclick: () => { signOut(); location.hash = '#/'; route(); } }, 'Sign out'));
}

async function route() {
  const current = ++generation;
  destroyCharts();
  const view = document.getElementById('view');
  fill(view);
  drawHeader();
  const context = { isCurrent: () => current === generation, session: currentSession() };
  if (!currentSession()) {
    showSignIn(view, async () => {
      drawHeader();
      if (location.hash === '' || location.hash === '#/' || location.hash === '#') {
        location.hash = home();
      } else {
        await route();
      }
    });
    return;
  }
  const hash = location.hash || '#/';
  if (hash === '#/' || hash === '#') {
    location.hash = home();
    return;
  }
  for (const [pattern, show] of routes) {
    const match = hash.match(pattern);
    if (match) {
      try {
        await show(view, context, ...match.slice(1).map(p => (p === undefined ? undefined : decodeURIComponent(p))));
      } catch (error) {
        if (context.isCurrent()) {
          view.append(errorBox(error));
        }
      }
      return;
    }
  }
  fill(view, note('This page does not exist.', 'warning'), h('p', {}, h('a', { href: home() }, 'Go to the start page')));
}

window.addEventListener('hashchange', route);
await restore();
await route();
