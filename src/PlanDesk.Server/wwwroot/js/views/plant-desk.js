// What a plant manager opens each morning: today's and tomorrow's targets for one plant, as figures, charts and
// an hourly table; acknowledging them; the plant's reported actuals against the targets. Printable.

import { h, fill, errorBox, note, panel, table } from '../dom.js';
import { api, idempotencyKey } from '../api.js';
import { currentSession } from '../session.js';
import { day, addDays, instant } from '../format.js';
import { keyFigures, hourTable, sheetCharts } from './plant-sheet.js';

const base = plantId => `/api/plants/${encodeURIComponent(plantId)}`;

function acknowledgeBlock(plantId, targets, acknowledgements, reload) {
  const current = acknowledgements.filter(a => a.version === targets.version);
  const message = h('div', { 'aria-live': 'polite' });
  const byInput = h('input', { name: 'acknowledgedBy', id: `ack-by-${targets.date}`, maxlength: 200, placeholder: 'your name or the control system' });
  const button = h('button', { type: 'submit', class: 'primary' }, `Acknowledge version ${targets.version}`);
  const form = h('form', { class: 'inline-form no-print', 'data-date': targets.date },
    h('label', { for: `ack-by-${targets.date}` }, 'Acknowledged by'), byInput, button);
  form.addEventListener('submit', async event => {
    event.preventDefault();
    button.disabled = true;
    try {
      await api(`${base(plantId)}/targets/${targets.date}/acknowledgements`, {
        method: 'POST',
        headers: { 'Idempotency-Key': idempotencyKey() },
        body: { version: targets.version, acknowledgedBy: byInput.value.trim() || null },
      });
      await reload();
    } catch (error) {
      fill(message, errorBox(error, 'Not acknowledged'));
      button.disabled = false;
    }
  });
  const status = current.length
    ? note(`Version ${targets.version} acknowledged ${instant(current[current.length - 1].receivedAt)}${current[current.length - 1].acknowledgedBy ? ` by ${current[current.length - 1].acknowledgedBy}` : ''}.`, 'success')
    : note(`Version ${targets.version} is not acknowledged yet.`, 'warning');
  return h('div', { class: 'acknowledge' }, status, current.length ? null : form, message);
}

/** One day's section; its charts are drawn by `draw()` once the section is in the page. */
async function daySection(plantId, date, label, actualsByStart) {
  const section = h('section', { class: 'panel plant-day', 'data-date': date });
  let plantName = null;
  let timeZone = null;
  let pending = [];
  const render = async () => {
    let targets;
    try {
      targets = await api(`${base(plantId)}/targets/${date}`);
    } catch (error) {
      fill(section, h('h2', {}, `${label}: ${day(date)}`), error.status === 404 ? note(`${error.title}. ${error.detail}`, 'warning') : errorBox(error));
      return;
    }
    const acknowledgements = await api(`${base(plantId)}/targets/${date}/acknowledgements`).catch(() => []);
    const sheet = targets.sheet;
    plantName = sheet.plantName;
    timeZone = sheet.timeZone;
    pending = [];
    fill(section,
      h('h2', {}, `${label}: ${day(date)}`),
      h('p', { class: 'hint' }, `Version ${targets.version}${targets.current ? '' : ' (superseded)'}, from plan ${targets.planId}, published ${instant(targets.publishedAt)}. ${sheet.hours.length} hours in this local day (${sheet.timeZone}).`),
      acknowledgeBlock(plantId, targets, acknowledgements, async () => { await render(); draw(); }),
      keyFigures(sheet),
      sheetCharts(sheet, actualsByStart, pending, date),
      h('details', { class: 'hours-details', open: true }, h('summary', {}, 'Hour by hour'), hourTable(sheet, actualsByStart)),
      h('p', { class: 'sheet-caution' }, h('strong', {}, 'Caution. '), sheet.caution));
  };
  const draw = () => {
    pending.forEach(drawChart => drawChart());
    pending = [];
  };
  await render();
  return { section, draw, plantName: () => plantName, timeZone: () => timeZone };
}

function actualsTable(hours, timeZone) {
  if (hours.length === 0) {
    return note('No actuals were reported for these days yet.');
  }
  return table([`Hour start (${timeZone ?? 'local'})`, 'Influent m3', 'Production m3', 'Outfall m3', 'Imported kWh', 'Generated kWh', 'Tank levels m3'],
    hours.slice(-48).map(({ hour }) => [
      instant(hour.hourStart, timeZone),
      hour.influentM3 ?? '–',
      hour.productionM3ByClass ? Object.entries(hour.productionM3ByClass).map(([c, v]) => `${c}: ${v}`).join(', ') : '–',
      hour.outfallM3 ?? '–', hour.energyImportedKWh ?? '–', hour.energyGeneratedKWh ?? '–',
      hour.tankLevelsM3 ? Object.entries(hour.tankLevelsM3).map(([t, v]) => `${t}: ${v}`).join(', ') : '–',
    ]), { caption: 'The latest reported hours (at most 48), as the plant sent them.' });
}

export async function showPlantDesk(view, context, plantId, dateParam) {
  const session = currentSession();
  const ownPlant = session?.plant?.plantId === plantId ? session.plant : null;
  const today = dateParam ?? ownPlant?.today ?? new Date().toISOString().slice(0, 10);
  const tomorrow = addDays(today, 1);
  const picker = h('input', { type: 'date', id: 'plant-date', value: today, 'aria-label': 'Day to show' });
  const controls = h('div', { class: 'toolbar no-print' },
    h('label', { for: 'plant-date' }, 'Day'), picker,
    h('button', { type: 'button', onclick: () => { if (picker.value) { location.hash = `#/plant/${encodeURIComponent(plantId)}/${picker.value}`; } } }, 'Show'),
    ownPlant?.publishedTo ? h('a', { href: `#/plant/${encodeURIComponent(plantId)}/${ownPlant.publishedTo}` }, `Latest published day (${day(ownPlant.publishedTo, { year: false })})`) : null,
    h('button', { type: 'button', onclick: () => window.print() }, 'Print'));
  const name = ownPlant?.name ?? plantId;
  fill(view, h('h1', { id: 'plant-name' }, `${name}: targets`), controls, h('p', { class: 'hint' }, 'Loading the targets…'));

  let actuals = { hours: [] };
  let actualsError = null;
  try {
    actuals = await api(`${base(plantId)}/actuals?from=${addDays(today, -1)}&to=${tomorrow}`);
  } catch (error) {
    actualsError = error;
  }
  if (!context.isCurrent()) {
    return;
  }
  if (actualsError && actualsError.status === 403) {
    fill(view, h('h1', { id: 'plant-name' }, 'Plant targets'), errorBox(actualsError));
    return;
  }
  const actualsByStart = new Map(actuals.hours.map(({ hour }) => [Date.parse(hour.hourStart), hour]));
  const days = [
    await daySection(plantId, today, dateParam ? 'Day' : 'Today', actualsByStart),
    await daySection(plantId, tomorrow, dateParam ? 'Next day' : 'Tomorrow', actualsByStart),
  ];
  if (!context.isCurrent()) {
    return;
  }
  const title = ownPlant?.name ?? days.map(d => d.plantName()).find(Boolean) ?? plantId;
  fill(view, h('h1', { id: 'plant-name' }, `${title}: targets`), controls, ...days.map(d => d.section),
    panel('Recent actuals', actualsError ? errorBox(actualsError) : actualsTable(actuals.hours, ownPlant?.timeZone ?? days.map(d => d.timeZone()).find(Boolean))));
  days.forEach(d => d.draw());
}
