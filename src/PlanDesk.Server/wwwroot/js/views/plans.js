// Plans and solves: the list of plans with their job state, a form to submit a solve and one to add a network
// version (scheduler keys only).

import { h, fill, errorBox, note, panel, table } from '../dom.js';
import { api } from '../api.js';
import { can } from '../session.js';
import { day, instant, money } from '../format.js';

const defaultHorizons = new Map();

/** The network file's own default horizon, read once per version, so the form starts on days its data cover. */
async function defaultHorizon(networkId, version) {
  const key = `${networkId}/${version}`;
  if (!defaultHorizons.has(key)) {
    defaultHorizons.set(key, api(`/api/networks/${encodeURIComponent(networkId)}/versions/${version}`)
      .then(answer => answer.document?.horizon ?? null)
      .catch(() => null));
  }
  return defaultHorizons.get(key);
}

function solveForm(networks) {
  const message = h('div', { 'aria-live': 'polite' });
  const network = h('select', { id: 'solve-network', name: 'network', required: true },
    networks.map(n => h('option', { value: n.networkId }, `${n.name} (${n.networkId}, version ${n.latestVersion})`)));
  const start = h('input', { id: 'solve-start', name: 'start', type: 'date', required: true });
  const days = h('input', { id: 'solve-days', name: 'days', type: 'number', min: 1, max: 7, value: 1, required: true });
  const limit = h('input', { id: 'solve-limit', name: 'limit', type: 'number', min: 1, max: 3600, value: 30, required: true });
  const button = h('button', { type: 'submit', class: 'primary' }, 'Solve');
  const useDefaults = async () => {
    const chosen = networks.find(n => n.networkId === network.value);
    const horizon = chosen ? await defaultHorizon(chosen.networkId, chosen.latestVersion) : null;
    if (horizon?.startDate) {
      start.value = horizon.startDate;
      days.value = horizon.days ?? 1;
    }
  };
  network.addEventListener('change', useDefaults);
  useDefaults();
  const form = h('form', { class: 'form-grid', id: 'solve-form' },
    h('label', { for: 'solve-network' }, 'Network'), network,
    h('label', { for: 'solve-start' }, 'First local day'), start,
    h('label', { for: 'solve-days' }, 'Days (1 to 7)'), days,
    h('label', { for: 'solve-limit' }, 'Time limit (s)'), limit,
    h('span'), button);
  form.addEventListener('submit', async event => {
    event.preventDefault();
    if (!start.value) {
      fill(message, errorBox({ title: 'First day missing', detail: 'Choose the first local day of the plan.' }));
      return;
    }
    button.disabled = true;
    try {
      const job = await api('/api/plans', {
        method: 'POST',
        body: { networkId: network.value, startDate: start.value, days: Number(days.value), options: { timeLimitSeconds: Number(limit.value) } },
      });
      location.hash = `#/jobs/${job.jobId}`;
    } catch (error) {
      fill(message, errorBox(error, 'The solve was not started'));
    } finally {
      button.disabled = false;
    }
  });
  return panel('New solve',
    h('p', { class: 'hint' }, 'Plans the network hour by hour over whole local days at least cost. A solve runs in the background; you can watch its progress.'),
    form, message);
}

function uploadForm() {
  const message = h('div', { 'aria-live': 'polite' });
  const id = h('input', { id: 'upload-id', name: 'networkId', required: true, pattern: '[a-z0-9][a-z0-9-]{0,63}', placeholder: 'e.g. vennick-valley' });
  const file = h('input', { id: 'upload-file', name: 'file', type: 'file', accept: '.json,application/json', required: true });
  const button = h('button', { type: 'submit' }, 'Upload');
  const form = h('form', { class: 'form-grid', id: 'upload-form' },
    h('label', { for: 'upload-id' }, 'Network id'), id,
    h('label', { for: 'upload-file' }, 'Network file (JSON)'), file,
    h('span'), button);
  form.addEventListener('submit', async event => {
    event.preventDefault();
    const chosen = file.files?.[0];
    if (!id.value.trim() || !chosen) {
      fill(message, errorBox({ title: 'Id or file missing', detail: 'Give the network an id (lower-case letters, digits, hyphens) and choose its JSON file.' }));
      return;
    }
    let document;
    try {
      document = JSON.parse(await chosen.text());
    } catch (error) {
      fill(message, errorBox({ title: `${chosen.name} is not JSON`, detail: `${error.message}. Check the file in a text editor, or run "plandesk validate" on it.` }));
      return;
    }
    button.disabled = true;
    try {
      const version = await api(`/api/networks/${encodeURIComponent(id.value.trim())}/versions`, { method: 'POST', body: document });
      fill(message, note(`Stored as version ${version.version} of network ${version.networkId} (${version.plants.length} plants).`, 'success'));
    } catch (error) {
      fill(message, errorBox(error, 'The network was not stored'));
    } finally {
      button.disabled = false;
    }
  });
  return panel('Add a network version',
    h('p', { class: 'hint' }, 'Upload a network file with its series inline. Every problem found is listed with its place in the file.'),
    form, message);
}

function planRow(plan) {
  const ready = plan.state === 'succeeded';
  const open = ready
    ? h('a', { href: `#/plan/${plan.planId}`, class: 'button small' }, 'Open')
    : ['queued', 'running'].includes(plan.state) ? h('a', { href: `#/jobs/${plan.planId}` }, 'Progress') : h('a', { href: `#/jobs/${plan.planId}` }, 'Details');
  return [
    String(plan.planId),
    `${plan.networkId} v${plan.networkVersion}`,
    day(plan.startDate),
    String(plan.days),
    h('span', { class: `state state-${plan.state}` }, plan.state),
    plan.status ?? '–',
    plan.totalCost === null || plan.totalCost === undefined ? '–' : money(plan.totalCost, ''),
    instant(plan.submittedAt),
    open,
  ];
}

export async function showPlans(view, context) {
  fill(view, h('h1', {}, 'Plans and solves'), h('p', { class: 'hint' }, 'Loading…'));
  const [plans, networks] = await Promise.all([api('/api/plans'), api('/api/networks')]);
  if (!context.isCurrent()) {
    return;
  }
  const newestFirst = [...plans].sort((a, b) => b.planId - a.planId);
  const list = newestFirst.length === 0
    ? note('No plans yet. Submit a solve to make the first one.')
    : table(['Plan', 'Network', 'First day', 'Days', 'Job', 'Status', 'Total cost', 'Submitted', ''], newestFirst.map(planRow), { className: 'grid plans' });
  const side = [];
  if (can.schedule()) {
    side.push(networks.length ? solveForm(networks) : note('No network is uploaded yet: add one below, then solve it.'));
    side.push(uploadForm());
  } else {
    side.push(note('Your key reads plans. Solving, uploading networks and publishing need a scheduler key.'));
  }
  fill(view,
    h('h1', {}, 'Plans and solves'),
    h('div', { class: 'columns' },
      h('div', { class: 'main-column' }, panel('Plans', list)),
      h('div', { class: 'side-column' }, side)));
}
