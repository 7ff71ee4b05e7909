// A solve job's progress, polled every second until it ends; then a way to open the plan.

import { h, fill, errorBox, note, panel } from '../dom.js';
import { api } from '../api.js';
import { can } from '../session.js';
import { day, num, instant } from '../format.js';

const pollMilliseconds = 1000;

function progressBlock(job) {
  const progress = job.progress;
  if (!progress) {
    return h('p', { class: 'hint' }, job.state === 'queued' ? 'Waiting for the solver to start…' : 'No progress reported yet.');
  }
  const share = progress.timeLimitSeconds > 0 ? Math.min(1, progress.elapsedSeconds / progress.timeLimitSeconds) : 0;
  return h('div', { class: 'progress-block' },
    h('p', {}, h('strong', {}, 'Phase: '), progress.phase),
    h('progress', { max: 1, value: share, 'aria-label': 'time used of the limit' }),
    h('p', { class: 'hint' }, `${num(progress.elapsedSeconds, 1)} s of at most ${num(progress.timeLimitSeconds)} s`),
    h('dl', { class: 'facts' },
      h('dt', {}, 'Best plan so far'), h('dd', {}, progress.incumbent === null ? 'none yet' : num(progress.incumbent, 2)),
      h('dt', {}, 'Best bound'), h('dd', {}, progress.bestBound === null ? 'unknown' : num(progress.bestBound, 2)),
      h('dt', {}, 'Gap'), h('dd', {}, progress.gapPercent === null ? 'unknown' : `${num(progress.gapPercent, 2)} %`)));
}

function render(box, job) {
  const finished = ['succeeded', 'failed', 'cancelled'].includes(job.state);
  const actions = [];
  if (job.state === 'succeeded') {
    actions.push(h('a', { class: 'button primary', href: `#/plan/${job.jobId}`, id: 'open-plan' }, 'Open the plan'));
  }
  if (!finished && can.schedule()) {
    actions.push(h('button', {
      type: 'button',
      onclick: async event => {
        event.target.disabled = true;
        try {
          await api(`/api/jobs/${job.jobId}/cancel`, { method: 'POST' });
        } catch (error) {
          box.append(errorBox(error, 'Not cancelled'));
        }
      },
    }, 'Cancel the solve'));
  }
  fill(box,
    h('p', { class: 'job-state' }, 'State: ', h('strong', { class: `state state-${job.state}`, id: 'job-state' }, job.state)),
    h('p', {}, `Network ${job.networkId} version ${job.networkVersion}, ${job.days} day${job.days > 1 ? 's' : ''} from ${day(job.startDate)}. Submitted ${instant(job.submittedAt)}.`),
    finished ? null : progressBlock(job),
    job.message ? note(job.message, job.state === 'succeeded' ? 'success' : job.state === 'failed' ? 'error' : 'info') : null,
    h('div', { class: 'actions' }, actions));
}

export async function showJob(view, context, jobId) {
  const box = h('div', { id: 'job' });
  fill(view, h('p', {}, h('a', { href: '#/plans' }, '← Plans and solves')), h('h1', {}, `Solve ${jobId}`), panel(null, box));
  for (;;) {
    let job;
    try {
      job = await api(`/api/jobs/${jobId}`);
    } catch (error) {
      if (context.isCurrent()) {
        fill(box, errorBox(error));
      }
      return;
    }
    if (!context.isCurrent()) {
      return;
    }
    render(box, job);
    if (['succeeded', 'failed', 'cancelled'].includes(job.state)) {
      return;
    }
    await new Promise(resolve => setTimeout(resolve, pollMilliseconds));
    if (!context.isCurrent()) {
      return;
    }
  }
}
