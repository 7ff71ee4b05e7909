// Every call to the PlanDesk API goes through here: the key is sent as a bearer token and any error answer
// (problem details) becomes an ApiError whose text is written for the person at the screen.

import { currentKey } from './session.js';

export class ApiError extends Error {
  constructor(status, title, detail, problems) {
    super(detail ? `${title}: ${detail}` : title);
    this.status = status;
    this.title = title;
    this.detail = detail;
    this.problems = problems ?? [];
  }
}

const statusWords = {
  0: 'The PlanDesk service did not answer',
  401: 'Your key was not accepted',
  403: 'Your key may not do that',
  404: 'Not found',
  409: 'Not possible right now',
  413: 'Too large',
  500: 'The service failed',
};

async function errorFrom(response) {
  let body = null;
  try {
    body = await response.json();
  } catch {
    // Not JSON (a proxy page, an empty body): fall back to the status in words.
  }
  const title = body?.title ?? statusWords[response.status] ?? `Request failed (HTTP ${response.status})`;
  const detail = body?.detail ?? (body ? '' : 'The answer could not be read; try again, or ask the PlanDesk administrator.');
  return new ApiError(response.status, title, detail, Array.isArray(body?.problems) ? body.problems : []);
}

/** Calls the API. `body` is sent as JSON; returns the parsed answer (null for an empty one). */
export async function api(path, { method = 'GET', body, headers = {}, key } = {}) {
  const sent = { ...headers, Accept: 'application/json' };
  const useKey = key ?? currentKey();
  if (useKey) {
    sent.Authorization = `Bearer ${useKey}`;
  }
  if (body !== undefined) {
    sent['Content-Type'] = 'application/json';
  }
  let response;
  try {
    response = await fetch(path, { method, headers: sent, body: body === undefined ? undefined : JSON.stringify(body) });
  } catch {
    throw new ApiError(0, statusWords[0], 'Check that "plandesk serve" is running and that this computer can reach it, then try again.');
  }
  if (!response.ok) {
    throw await errorFrom(response);
  }
  const text = await response.text();
  return text ? JSON.parse(text) : null;
}

/** A fresh key for requests the server must not count twice (acknowledgements, actuals). */
export function idempotencyKey() {
  if (crypto.randomUUID) {
    return crypto.randomUUID();
  }
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return Array.from(bytes, b => b.toString(16).padStart(2, '0')).join('');
}
