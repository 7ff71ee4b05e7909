// Numbers, units, dates and hours as people read them: "1 240 m3", "Sun 28 Mar 03:00".

const narrowSpace = '\u202f';

/** A number with grouped thousands and at most (with `fixed`, exactly) `decimals` decimals; "–" for a missing value. */
export function num(value, decimals = 0, { fixed = false } = {}) {
  if (value === null || value === undefined || Number.isNaN(value)) {
    return '–';
  }
  const rounded = Math.round(value * 10 ** decimals) / 10 ** decimals;
  const text = (Object.is(rounded, -0) ? 0 : rounded).toLocaleString('en-US', { maximumFractionDigits: decimals, minimumFractionDigits: fixed ? decimals : 0 });
  return text.replace(/,/g, narrowSpace).replace(/^-/, '−');
}

/** A quantity with its unit, e.g. qty(1240, 'm3') → "1 240 m3". */
export function qty(value, unit, decimals = 0) {
  return value === null || value === undefined ? '–' : `${num(value, decimals)} ${unit}`;
}

export function money(value, currency) {
  return value === null || value === undefined ? '–' : `${num(value, 2, { fixed: true })} ${currency}`.trimEnd();
}

export function percent(value, decimals = 0) {
  return value === null || value === undefined ? '–' : `${num(value, decimals)} %`;
}

const weekdays = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
const months = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "2027-03-28" → "Sun 28 Mar 2027" (the date is a local calendar day, so no time zone is involved). */
export function day(isoDate, { year = true } = {}) {
  const [y, m, d] = isoDate.split('-').map(Number);
  const weekday = weekdays[new Date(Date.UTC(y, m - 1, d)).getUTCDay()];
  return `${weekday} ${d} ${months[m - 1]}${year ? ` ${y}` : ''}`;
}

/** The local clock time of a period start "2027-03-28T03:00:00" → "03:00". */
export function clock(localStart) {
  return localStart.slice(11, 16);
}

/** The tooltip title of a period: "Sun 28 Mar 03:00 (UTC+02:00)". */
export function periodTitle(period) {
  return `${day(period.localStart.slice(0, 10), { year: false })} ${clock(period.localStart)} (UTC${period.utcOffset})`;
}

/** A moment as date and time, in the given IANA zone (the browser's own when none is given). */
export function instant(isoInstant, timeZone) {
  const date = new Date(isoInstant);
  return date.toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone });
}

/** Adds days to an ISO date. */
export function addDays(isoDate, days) {
  const [y, m, d] = isoDate.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

export const periodUnit = minutes => (minutes === 60 ? 'per hour' : `per ${minutes} min`);
