// Publishing a plan: which plant-days it covers, which published versions it supersedes, and a confirmation
// that says so before anything is sent to the plants.

import { h, fill, errorBox, note, panel, table } from '../dom.js';
import { api } from '../api.js';
import { can, currentSession } from '../session.js';
import { day } from '../format.js';
import { planDocument, planHeader, forget } from './plan-common.js';

function supersededText(preview) {
  const replaced = preview.plantDays.filter(d => d.currentVersion !== null && d.currentVersion !== undefined);
  if (replaced.length === 0) {
    return 'No targets are published yet for these plant-days, so nothing is superseded.';
  }
  return `It supersedes ${replaced.length} published version${replaced.length === 1 ? '' : 's'}: ` +
    replaced.map(d => `${d.plantName} on ${day(d.date, { year: false })} (version ${d.currentVersion}, from plan ${d.currentPlanId})`).join('; ') + '.';
}

function coverageText(preview) {
  const byPlant = new Map();
  for (const d of preview.plantDays) {
    byPlant.set(d.plantName, [...(byPlant.get(d.plantName) ?? []), day(d.date, { year: false })]);
  }
  return [...byPlant].map(([plant, days]) => `${plant} (${days.join(', ')})`).join('; ');
}

function previewTable(preview) {
  return table(['Plant', 'Local day', 'Now in force', 'After publishing'], preview.plantDays.map(d => [
    d.plantName,
    day(d.date),
    d.currentVersion === null || d.currentVersion === undefined ? 'nothing published' : `version ${d.currentVersion} (plan ${d.currentPlanId})`,
    d.currentVersion === null || d.currentVersion === undefined ? 'version 1 (this plan)' : `version ${d.currentVersion + 1} (this plan)`,
  ]), { className: 'grid preview' });
}

function confirmDialog(planId, preview, onPublished) {
  const message = h('div', { 'aria-live': 'polite' });
  const noteInput = h('input', { id: 'publish-note', name: 'note', maxlength: 500, placeholder: 'optional, e.g. re-plan after the storm forecast' });
  const confirm = h('button', { type: 'submit', class: 'primary', id: 'publish-confirm' }, `Publish ${preview.plantDays.length} plant-day${preview.plantDays.length === 1 ? '' : 's'}`);
  const dialog = h('dialog', { class: 'confirm', id: 'publish-dialog', 'aria-labelledby': 'publish-title' });
  const form = h('form', { method: 'dialog' },
    h('h2', { id: 'publish-title' }, `Publish plan ${planId}?`),
    h('p', {}, `These targets become the current ones for ${coverageText(preview)}.`),
    h('p', { id: 'publish-supersedes' }, supersededText(preview)),
    h('p', { class: 'hint' }, 'Plants read their new targets at their next request; earlier versions stay in the history.'),
    h('label', { for: 'publish-note' }, 'Note kept with the publication'), noteInput,
    message,
    h('div', { class: 'actions' }, confirm, h('button', { type: 'button', onclick: () => dialog.close() }, 'Cancel')));
  form.addEventListener('submit', async event => {
    event.preventDefault();
    confirm.disabled = true;
    try {
      const publication = await api(`/api/plans/${planId}/publish`, { method: 'POST', body: noteInput.value.trim() ? { note: noteInput.value.trim() } : {} });
      dialog.close();
      onPublished(publication);
    } catch (error) {
      fill(message, errorBox(error, 'Not published'));
    } finally {
      confirm.disabled = false;
    }
  });
  dialog.append(form);
  return dialog;
}

export async function showPublish(view, context, planIdText) {
  const planId = Number(planIdText);
  const summary = await planDocument(planId, 'summary');
  forget(planId, 'publication-preview');
  const preview = await planDocument(planId, 'publication-preview');
  if (!context.isCurrent()) {
    return;
  }
  const result = h('div', { id: 'publish-result', 'aria-live': 'polite' });
  const session = currentSession();
  const roleNote = can.schedule() ? null
    : note(`Publishing needs a scheduler key; you are signed in with a ${session?.role} key, so the service will refuse it.`, 'warning');
  let body;
  if (!preview.publishable) {
    body = [note(preview.reason, 'warning')];
  } else {
    const dialog = confirmDialog(planId, preview, publication => {
      fill(result, note(`Published as publication ${publication.publicationId}: ${publication.targets.length} plant-day targets are now current.`, 'success'));
      showPublishTable();
    });
    const open = h('button', { type: 'button', class: 'primary', id: 'publish-open', onclick: () => dialog.showModal() }, 'Publish this plan…');
    body = [roleNote, h('p', {}, `Publishing sends this plan's targets to the plants: ${coverageText(preview)}.`), open, dialog];
  }
  const tableBox = h('div', {}, previewTable(preview));
  async function showPublishTable() {
    forget(planId, 'publication-preview');
    try {
      fill(tableBox, previewTable(await planDocument(planId, 'publication-preview')));
    } catch (error) {
      fill(tableBox, errorBox(error));
    }
  }
  fill(view, ...planHeader(summary, '/publish'),
    summary.status !== 'optimal' && preview.publishable ? note(`This plan is ${summary.status}: ${summary.status === 'feasible' ? 'good but not proven best' : ''}. Check its problems before publishing.`, 'warning') : null,
    panel('Publish', ...body, result),
    panel('Plant-days in this plan', tableBox));
}
