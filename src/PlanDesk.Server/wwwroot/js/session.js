// The signed-in key lives in this browser tab only (sessionStorage): closing the tab signs out.

import { api } from './api.js';

const storageKey = 'plandesk.key';
let session = null;

export function currentKey() {
  return sessionStorage.getItem(storageKey);
}

export function currentSession() {
  return session;
}

/** Checks the key with the service; on success keeps it and returns who it is, else throws the ApiError. */
export async function signIn(key) {
  const me = await api('/api/me', { key });
  sessionStorage.setItem(storageKey, key);
  session = me;
  return me;
}

/** Restores the session of this tab, or null when there is none or the key no longer works. */
export async function restore() {
  const key = currentKey();
  if (!key) {
    return null;
  }
  try {
    return await signIn(key);
  } catch {
    signOut();
    return null;
  }
}

export function signOut() {
  sessionStorage.removeItem(storageKey);
  session = null;
}

export const can = {
  schedule: () => session?.role === 'scheduler',
  readPlans: () => session?.role === 'scheduler' || session?.role === 'viewer',
};
