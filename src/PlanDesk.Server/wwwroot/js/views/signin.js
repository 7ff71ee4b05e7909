// Sign-in with an API key. The key is checked with the service before anything else is shown.

import { h, fill, errorBox } from '../dom.js';
import { signIn } from '../session.js';

export function showSignIn(view, done) {
  const message = h('div', { class: 'sign-in-message', 'aria-live': 'polite' });
  const input = h('input', {
    id: 'key', name: 'key', type: 'password', autocomplete: 'off', spellcheck: 'false', required: true,
    placeholder: 'pdk_…', 'aria-describedby': 'key-help',
  });
  const button = h('button', { type: 'submit', class: 'primary' }, 'Sign in');
  const form = h('form', { class: 'sign-in', novalidate: true },
    h('h1', {}, 'Sign in to PlanDesk'),
    h('label', { for: 'key' }, 'API key'),
    input,
    h('p', { id: 'key-help', class: 'hint' },
      'Paste the key you were given. A scheduler key plans and publishes, a viewer key reads plans, a plant key shows one plant\'s targets. ',
      'A scheduler creates keys with ', h('code', {}, 'plandesk keys add'), '. The key is kept only in this browser tab.'),
    button,
    message);
  form.addEventListener('submit', async event => {
    event.preventDefault();
    const key = input.value.trim();
    if (!key) {
      fill(message, errorBox({ title: 'No key given', detail: 'Paste your API key into the field, then press Sign in.' }));
      return;
    }
    button.disabled = true;
    fill(message, h('p', { class: 'hint' }, 'Checking the key…'));
    try {
      await signIn(key);
      done();
    } catch (error) {
      fill(message, errorBox(error, 'Sign-in failed'));
    } finally {
      button.disabled = false;
    }
  });
  fill(view, form);
  input.focus();
}
