/**
 * The page: opens on the share link's scenario, else the autosaved one, else the demo; every edit is autosaved and
 * re-run (debounced) in the solver worker; results replace the last good ones, errors are shown beside their fields.
 * Performance marks time the page: `freezeline:editor` (editor drawn), `…:edit`, `…:run-start`, `…:result`,
 * `…:verdict` (numbers on screen), `…:temperatures-plotted`, `…:plotted` (all charts drawn).
 */
import './early-solver.ts';
import './style.css';
import type { FieldError } from '../sim/index.ts';
import { demoScenario } from './demo.ts';
import { createDraftStore } from './draft.ts';
import { byId } from './dom.ts';
import { clearFieldErrors, showFieldErrors } from './errors-view.ts';
import { renderFaceEditor } from './faces-editor.ts';
import { renderEdgesEditor } from './edges-editor.ts';
import { syncPeers } from './fields.ts';
import { fieldsToFill, markFieldsToFill } from './incomplete.ts';
import { download, fileStem, readScenarioFile, scenarioText } from './files.ts';
import { seriesCsv } from '../sim/index.ts';
import { formatNumber } from './format.ts';
import { terms } from '../sim/index.ts';
import { asNumber, isObject, type JsonObject } from './json.ts';
import { autosave, forgetAutosaved, fromHash, loadAutosaved, shareLink } from './persist.ts';
import { firstNonFinite } from './protocol.ts';
import { shownResult } from './result.ts';
import { createResultsView } from './results-view.ts';
import { createRunner } from './runner.ts';
import { createOperatingPanel } from './operating-view.ts';
import { createStudyPanel } from './study-view.ts';
import { renderSetupEditor, type SetupEditor } from './setup-editor.ts';
import { refreshSourceNotes } from './source-rows.ts';
import { renderStackEditor } from './stack-editor.ts';
import { createStatusView } from './status-view.ts';

const notice = byId('notice');
let noticeTimer: ReturnType<typeof setTimeout> | undefined;
function tell(message: string): void {
  notice.textContent = message;
  notice.hidden = false;
  if (noticeTimer !== undefined) clearTimeout(noticeTimer);
  noticeTimer = setTimeout(() => { notice.hidden = true; }, 8000);
}

const hash = fromHash(location.hash);
if (hash.scenario || hash.error) history.replaceState(null, '', `${location.pathname}${location.search}`);
if (hash.error) tell(hash.error);
const store = createDraftStore(hash.scenario ?? loadAutosaved() ?? demoScenario());
if (hash.scenario) autosave(store.current());

const editorRoot = byId('stack-editor').closest('.editor') ?? document.body;
const generalErrors = byId('general-errors');
let lastErrors: readonly FieldError[] = [];
let setup: SetupEditor | undefined;

function renderEditors(): void {
  renderStackEditor(byId('stack-editor'), store, tell);
  setup = renderSetupEditor(byId('setup'), store);
  renderFaceEditor(byId('faces-top'), store, 'top');
  renderFaceEditor(byId('faces-bottom'), store, 'bottom');
  renderEdgesEditor(byId('edges'), store);
  showFieldErrors(editorRoot, generalErrors, lastErrors);
}

const results = createResultsView();
const operating = createOperatingPanel(byId('operating'));
createStudyPanel(byId('study'), store);
const status = createStatusView(() => runner.cancel());
const runner = createRunner({
  onStart: () => {
    performance.mark('freezeline:run-start');
    status.set('running', 'computing…');
  },
  onProgress: (tS) => {
    status.progress(tS, asNumber(store.current().duration_s));
    // only a run long enough to report progress marks the shown result as old: quick runs do not flicker
    if (results.current()) results.stale('Computing the edited scenario; the result shown is the previous one.');
  },
  onDone: (job, scenario, record, summary, solveMs, accuracy) => {
    const bad = firstNonFinite(record);
    if (bad !== undefined || !isObject(scenario)) {
      status.set('failed', `internal error: the result holds a non-finite value (${bad ?? 'scenario'}); nothing shown`);
      return;
    }
    lastErrors = [];
    clearFieldErrors(editorRoot, generalErrors);
    results.stale(undefined);
    performance.mark('freezeline:result');
    // nodes are the cell centres plus the two face points (sim/observe/record.ts)
    status.set('done', `${record.nodeXMm.length - 2} ${terms.cell.term}s, ${record.tS.length} time points, solved in ${formatNumber(solveMs, { decimals: 0 })} ms`);
    const drawn = results.show(shownResult(job, scenario as JsonObject, record, summary, accuracy));
    performance.mark('freezeline:verdict');
    void drawn.then(() => performance.mark('freezeline:plotted'));
    // the window search (many runs) starts once the charts are drawn, in its own worker
    void drawn.then(() => { if (results.current()?.job === job) operating.request(scenario); });
  },
  onErrors: (errors) => {
    lastErrors = errors;
    const beside = showFieldErrors(editorRoot, generalErrors, errors);
    status.set('error', `${errors.length} field${errors.length === 1 ? '' : 's'} to fix${beside < errors.length ? ' (see the list above the stack)' : ''}`);
    if (results.current()) results.stale('Showing the last good result: the scenario as edited cannot be computed yet.');
    else results.placeholder('Nothing computed yet: fix the fields marked in red.');
  },
  onFailed: (message, stopped) => {
    status.set('failed', message);
    if (stopped && isObject(stopped.scenario) && firstNonFinite(stopped.record) === undefined) {
      // a run that stopped for a physical reason or at the ceiling: its curves up to the stop, its verdicts marked as
      // such; no operating-duration search (its runs would stop too, each at the same cost)
      lastErrors = [];
      clearFieldErrors(editorRoot, generalErrors);
      results.stale(undefined);
      void results.show(shownResult(stopped.job, stopped.scenario as JsonObject, stopped.record, stopped.summary, undefined, { tS: stopped.tS, message }));
      operating.clear('No operating duration: the run of this scenario stopped before its end (see the verdict).');
      return;
    }
    if (results.current()) results.stale('Showing the last good result: the last run did not finish.');
    else results.placeholder(`Nothing computed: ${message}`);
  },
  onCancelled: () => {
    status.set('cancelled', 'run cancelled; edit anything to run again');
    if (results.current()) results.stale('Showing the last good result: the run of the edited scenario was cancelled.');
    else results.placeholder('Nothing computed: the run was cancelled. Edit anything to run again.');
  },
});

/** Requests a run, unless a new row still has fields to fill in (then nothing runs, and nothing is an error). */
function requestRun(now = false): void {
  const toFill = fieldsToFill(store.current());
  markFieldsToFill(editorRoot, toFill);
  if (toFill.length > 0) {
    runner.hold();
    status.set('waiting', `fill in the ${toFill.length} field${toFill.length === 1 ? '' : 's'} marked “to fill in” to run`);
    if (results.current()) results.stale('Showing the last result: a new row is not filled in yet.');
    else results.placeholder('Nothing computed yet: fill in the fields marked “to fill in”.');
    return;
  }
  status.set('running', 'waiting for the edit to settle…');
  runner.request(store.current(), now);
}

store.listen((change) => {
  autosave(store.current());
  if (change.kind === 'field') {
    syncPeers(editorRoot, store, change.path, change.source);
    refreshSourceNotes(editorRoot, store);
    // any field may change which inputs end at heat off (a row's start, a source's end, a layer the core now reads)
    setup?.refresh();
  } else {
    renderEditors();
  }
  performance.mark('freezeline:edit');
  requestRun();
});

byId('save-json').addEventListener('click', () =>
  download(`${fileStem(store.current())}.json`, scenarioText(store.current()), 'application/json'));

const fileInput = byId<HTMLInputElement>('load-json');
fileInput.addEventListener('change', () => {
  const file = fileInput.files?.[0];
  if (!file) return;
  void readScenarioFile(file).then((read) => {
    fileInput.value = '';
    if (!read.ok) { tell(`Not loaded: ${read.message}.`); return; }
    lastErrors = [];
    store.replace(read.value, 'file');
    tell(`Loaded ${file.name}.`);
  });
});

byId('share-link').addEventListener('click', () => {
  const url = shareLink(store.current());
  const box = byId('share-box');
  const field = byId<HTMLInputElement>('share-url');
  box.hidden = false;
  field.value = url;
  field.select();
  const note = byId('share-note');
  note.textContent = `${url.length} characters`;
  navigator.clipboard?.writeText(url).then(() => { note.textContent = `copied — ${url.length} characters`; }, () => undefined);
});

byId('export-csv').addEventListener('click', () => {
  const r = results.current();
  if (!r) { tell('Nothing to export yet: no result has been computed.'); return; }
  download(`${fileStem(r.scenario)}-series.csv`, seriesCsv(r.record), 'text/csv');
});

byId('reset-demo').addEventListener('click', () => {
  if (!confirm('Replace the scenario being edited with the demo? Save it first if you want to keep it.')) return;
  forgetAutosaved();
  lastErrors = [];
  store.replace(demoScenario(), 'demo');
});

renderEditors();
performance.mark('freezeline:editor');
requestRun(true);
