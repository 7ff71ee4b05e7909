// One plant-day target sheet drawn for people: key figures, hourly table and charts, with the plant's reported
// actuals beside the targets where there are any.

import { h, table } from '../dom.js';
import { num, qty, clock, periodUnit } from '../format.js';
import { chartBox, makeChart, colours, valueAxis, line, bars, limitLines } from '../charts.js';

const purple = ['#3d1f6b', '#6a43a6', '#9474c6', '#b9a3dc'];
const tankColours = ['#2c6e8f', '#2f8a5c', '#b97a2a', '#7b2d3b'];

/** Periods of a sheet in the shape the chart helpers take (the offset is local time minus UTC). */
export function sheetPeriods(sheet) {
  return sheet.hours.map((hour, index) => {
    const minutes = (Date.parse(`${hour.localStart}Z`) - Date.parse(hour.start)) / 60000;
    const sign = minutes < 0 ? '-' : '+';
    const abs = Math.abs(minutes);
    const offset = `${sign}${String(Math.floor(abs / 60)).padStart(2, '0')}:${String(abs % 60).padStart(2, '0')}`;
    return { index, localStart: hour.localStart, utcOffset: offset, day: 0 };
  });
}

const keysOf = (hours, field) => [...new Set(hours.flatMap(hour => Object.keys(hour[field] ?? {})))].sort();

export function keyFigures(sheet) {
  const permit = sheet.permit;
  const headroom = permit.totalNitrogenHeadroomKg;
  return h('dl', { class: 'figures' },
    h('div', {}, h('dt', {}, 'Treatment level'), h('dd', {}, sheet.treatmentLevelName),
      h('dd', { class: 'hint' }, `effluent total N ${num(sheet.effluentTotalNitrogenMgPerL, 1)} mg/L, total P ${num(sheet.effluentTotalPhosphorusMgPerL, 2)} mg/L`)),
    h('div', {}, h('dt', {}, 'Outfall'), h('dd', {}, qty(permit.outfallM3, 'm3')),
      h('dd', { class: 'hint' }, `total N ${qty(permit.totalNitrogenKg, 'kg', 1)}${permit.dailyTotalNitrogenCapKg === null ? '' : ` of ${qty(permit.dailyTotalNitrogenCapKg, 'kg', 1)} cap`}${headroom === null ? '' : `, headroom ${qty(headroom, 'kg', 1)}`}`)),
    h('div', {}, h('dt', {}, 'Energy'), h('dd', {}, `${qty(sheet.energy.importKWh, 'kWh')} imported`),
      h('dd', { class: 'hint' }, `engine ${qty(sheet.energy.engineKWh, 'kWh')}, exported ${qty(sheet.energy.exportKWh, 'kWh')}, load ${qty(sheet.energy.loadKWh, 'kWh')}, peak import ${qty(sheet.energy.peakImportKw, 'kW')}`)),
    h('div', {}, h('dt', {}, 'Deliveries'), h('dd', {}, qty(sheet.deliveries.reduce((a, d) => a + d.volumeM3, 0), 'm3')),
      h('dd', { class: 'hint' }, sheet.deliveries.map(d => `${d.customerName} ${qty(d.volumeM3, 'm3')} (class ${d.class})`).join('; ') || 'none')));
}

export function hourTable(sheet, actualsByStart) {
  const classes = keysOf(sheet.hours, 'productionM3ByClass');
  const stages = keysOf(sheet.hours, 'unitsRunning');
  const tanks = keysOf(sheet.hours, 'tankEndM3');
  const withActuals = actualsByStart.size > 0;
  const headings = ['Local time', 'Treated m3',
    ...classes.map(c => `Class ${c} m3`), ...(withActuals ? ['Actual production m3'] : []),
    ...stages.map(s => `Units ${s}`), ...tanks.map(t => `${t} end m3`), ...(withActuals ? ['Actual tank m3'] : []),
    'Outfall m3', 'Import kWh', 'Engine kWh'];
  const rows = sheet.hours.map((hour, i) => {
    const actual = actualsByStart.get(Date.parse(hour.start));
    const previous = i > 0 && clock(sheet.hours[i - 1].localStart) === clock(hour.localStart);
    return [
      `${clock(hour.localStart)}${previous ? ' (2nd)' : ''}`, num(hour.treatedM3),
      ...classes.map(c => num(hour.productionM3ByClass[c] ?? 0)),
      ...(withActuals ? [actual?.productionM3ByClass ? num(Object.values(actual.productionM3ByClass).reduce((a, b) => a + b, 0)) : '–'] : []),
      ...stages.map(s => String(hour.unitsRunning[s] ?? 0)),
      ...tanks.map(t => num(hour.tankEndM3[t] ?? 0)),
      ...(withActuals ? [actual?.tankLevelsM3 ? Object.values(actual.tankLevelsM3).map(v => num(v)).join(' / ') : '–'] : []),
      num(hour.outfallM3), num(hour.importKWh), num(hour.engineKWh),
    ];
  });
  return table(headings, rows, { className: 'grid hours', caption: `${sheet.hours.length} hourly rows (local time, ${sheet.timeZone}); volumes in m3 over the hour, energy in kWh over the hour.` });
}

export function sheetCharts(sheet, actualsByStart, draws, suffix) {
  const periods = sheetPeriods(sheet);
  const per = periodUnit(60);
  const classes = keysOf(sheet.hours, 'productionM3ByClass');
  const tanks = keysOf(sheet.hours, 'tankEndM3');
  const actualOf = hour => actualsByStart.get(Date.parse(hour.start));
  const hasActuals = sheet.hours.some(hour => actualOf(hour));

  const production = chartBox('Production target by class, and outfall', `m3 ${per}${hasActuals ? '; dots: production the plant reported' : ''}.`, { height: 230, testId: `sheet-production-${suffix}` });
  const productionSets = classes.map((c, i) => bars(`class ${c} target`, sheet.hours.map(hour => hour.productionM3ByClass[c] ?? 0), purple[i % purple.length], { unit: 'm3', decimals: 0, stack: 'target' }));
  productionSets.push(line('outfall target', sheet.hours.map(hour => hour.outfallM3), colours.outfall, { unit: 'm3', decimals: 0 }));
  if (hasActuals) {
    productionSets.push({ ...line('actual production', sheet.hours.map(hour => {
      const values = actualOf(hour)?.productionM3ByClass;
      return values ? Object.values(values).reduce((a, b) => a + b, 0) : null;
    }), colours.ink, { unit: 'm3', decimals: 0 }), showLine: false, pointRadius: 4 });
  }
  draws.push(() => makeChart(production.canvas, { datasets: productionSets, periods, zone: sheet.timeZone, stacked: true, scales: { y: valueAxis(`volume (m3 ${per})`, { stacked: true }) } }));

  // Sheets published before tank limits were added have no `tanks`; their chart simply draws no limit lines.
  const limitsOf = t => (sheet.tanks ?? []).find(k => k.tank === t);
  const hasLimits = tanks.some(limitsOf);
  const levelCaption = `m3 at the end of each hour${hasLimits ? '; dashed: each tank\'s minimum and maximum' : ''}${hasActuals ? '; dots: levels the plant reported' : ''}.`;
  const levels = chartBox('Tank level targets', levelCaption, { height: 230, testId: `sheet-tanks-${suffix}` });
  const levelSets = tanks.flatMap((t, i) => {
    const colour = tankColours[i % tankColours.length];
    const sets = [line(`${t} target`, sheet.hours.map(hour => hour.tankEndM3[t] ?? null), colour, { unit: 'm3', decimals: 0 })];
    if (hasActuals) {
      sets.push({ ...line(`${t} actual`, sheet.hours.map(hour => actualOf(hour)?.tankLevelsM3?.[t] ?? null), colour, { unit: 'm3', decimals: 0 }), showLine: false, pointRadius: 4 });
    }
    const limits = limitsOf(t);
    if (limits) {
      // With several tanks, each line is named after its tank, and every other tank is named at the left end so
      // that close limits of two tanks (a minimum of 0 and one of 100 m3) do not compete for the same spot.
      const name = tanks.length > 1 ? t : '';
      const side = i % 2 === 0 ? 'right' : 'left';
      sets.push(...limitLines(sheet.hours.length, { min: limits.minM3, max: limits.maxM3, unit: 'm3', name, maxColour: colour, minColour: colour, side }));
    }
    return sets;
  });
  draws.push(() => makeChart(levels.canvas, { type: 'line', datasets: levelSets, periods, zone: sheet.timeZone, scales: { y: valueAxis('volume (m3)', { grace: '5%' }) } }));
  return h('div', { class: 'chart-grid two' }, production.element, levels.element);
}

