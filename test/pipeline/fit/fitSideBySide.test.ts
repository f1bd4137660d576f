import { existsSync, mkdirSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fitSideBySide, runFit, type SideBySideRequest } from '../../../src/pipeline/index.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { runCommandLine } from '../../support/runCommandLine.js';
import { CANDELA_COMMAND, checkpointStep, runAndSignal, stepsInRunRecord, temporaryFiles } from '../../support/signalledRun.js';

// `candela fit CONFIG` with several models and two threads or more fits the models side by side, each in a
// process of its own (`fit --model LABEL --workers k`). Checked on the real command (dist/, built first) against the
// same configuration fitted in turn: the chains and the summaries must be the same bytes, signals must stop every
// model as they stop one, and --resume must finish them all. Data: the Pantheon 2018 binned Hubble diagram
// (../shared/data-real/pantheon2018, Scolnic et al. 2018); the fits are short on purpose.
const scratch = resolve('.candela-tmp/fit-side-by-side');
/** Longest wait from the signal to each model's "stopped at step" line, s: the requirement on interrupts (as for one model). */
const STOP_DELAY_SECONDS = 1;
/**
 * Longest wait from the signal to the conductor's exit, s, every output written: a guard against a hang, not a speed
 * target. Two models write their summaries at once, then the conductor reads both folders back for the models page;
 * measured 3.8 and 4.1 s with the load average at 15 on this project's 2 cores (other test files running).
 */
const EXIT_DELAY_SECONDS = 10;

const THREE_MODELS = [
  '  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }',
  '  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
  '  - { label: curved_lcdm, dark_energy: lambda, curvature: free }',
];
type Stop = 'max_steps' | 'converged';

/**
 * The two configurations of these tests, with a thread budget of 2: two models that converge (at step 600 or so, with
 * check_every 100), and three that stop at max_steps (an unreachable ESS target). Every run of a configuration uses
 * the same file (the summaries quote its path and hash) and its own folder (--out, which no summary quotes).
 */
const CONFIGS: Record<Stop, { path: string; models: string[] }> = {
  converged: { path: join(scratch, 'converged.yaml'), models: ['flat_lcdm', 'flat_wcdm'] },
  max_steps: { path: join(scratch, 'max_steps.yaml'), models: ['flat_lcdm', 'flat_wcdm', 'curved_lcdm'] },
};

function writeConfigs(): void {
  for (const stop of ['converged', 'max_steps'] as const) {
    const sampler = stop === 'max_steps'
      ? '{ walkers: 8, ensembles: 2, max_steps: 1200, check_every: 100, checkpoint_every: 50, target_ess: 1000000, workers: 2 }'
      : '{ walkers: 8, ensembles: 2, max_steps: 4000, check_every: 100, checkpoint_every: 50, target_ess: 200, max_rhat: 1.05, workers: 2 }';
    writeFileSync(CONFIGS[stop].path, pantheonBinnedConfig({
      title: 'side by side test', seed: 11,
      models: THREE_MODELS.slice(0, CONFIGS[stop].models.length).join('\n'),
      parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }\n  omega_de: { prior: uniform, min: 0.0, max: 1.5 }',
      sampler,
      output: `{ dir: ${join(scratch, `default-${stop}`)}, figures: [], png: false }`,
    }));
  }
}

/** The folder of the configuration fitted in turn, in this process, with one thread: the reference. */
const referenceOf = (stop: Stop) => join(scratch, `reference-${stop}`);

/** Every file of a run folder whose bytes follow from the chains alone (run.json and the checkpoint also hold the wall time and thread count). */
function chainFiles(runDir: string): string[] {
  const inFolder = (folder: string) => (existsSync(join(runDir, folder)) ? readdirSync(join(runDir, folder)).map((name) => `${folder}/${name}`) : []);
  return ['chains.csv', 'chain-record.bin', 'summary.md', 'table.tex', 'hubble_diagram.csv', 'hubble_model.csv', ...inFolder('marginals'), ...inFolder('contours')];
}

/** summary.json without the facts of the session (wall time, threads). */
function summaryWithoutSession(runDir: string): string {
  return readFileSync(join(runDir, 'summary.json'), 'utf8')
    .replace(/"wall_seconds": [^,\n]+/g, '"wall_seconds": -').replace(/"worker_threads": \d+/g, '"worker_threads": -');
}

function expectSameRuns(dir: string, referenceDir: string, models: string[]): void {
  for (const label of models) {
    const files = chainFiles(join(referenceDir, label));
    expect(files.length).toBeGreaterThan(6);
    for (const file of files) expect(readFileSync(join(dir, label, file)).equals(readFileSync(join(referenceDir, label, file))), `${label}/${file}`).toBe(true);
    expect(summaryWithoutSession(join(dir, label))).toBe(summaryWithoutSession(join(referenceDir, label)));
  }
  for (const file of ['index.html', 'models.tex']) expect(readFileSync(join(dir, file)).equals(readFileSync(join(referenceDir, file))), file).toBe(true);
}

/** Processes still running whose command line names `text` (this test's own models, found in /proc). */
function processesNaming(text: string): number[] {
  return readdirSync('/proc').filter((entry) => /^\d+$/.test(entry)).flatMap((pid) => {
    try {
      return readFileSync(join('/proc', pid, 'cmdline'), 'utf8').includes(text) ? [Number(pid)] : [];
    } catch {
      return [];
    }
  });
}

const fit = (args: string[]) => runAndSignal(['fit', ...args], [], () => false);

beforeAll(async () => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
  if (!existsSync(CANDELA_COMMAND)) throw new Error(`build first (npm run build): ${CANDELA_COMMAND} is missing`);
  writeConfigs();
  for (const stop of ['converged', 'max_steps'] as const) {
    const outcomes = await runFit({ configPath: CONFIGS[stop].path, outDir: referenceOf(stop), workers: 1 });
    for (const outcome of outcomes) expect(outcome.record.run.stop_reason).toBe(stop);
  }
}, 300_000);
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('candela fit with several models and two threads or more', () => {
  it('fits two models at once, one thread each, with the chains, summaries and models pages of a fit in turn, byte for byte', async () => {
    const { path: config, models } = CONFIGS.converged;
    const out = join(scratch, 'side-by-side');
    const run = await fit([config, '--out', out]);
    expect(run.code, run.stderr).toBe(0);
    expect(run.stderr).toContain('2 models side by side, 2 at a time with 1 worker thread each');
    // Both models started before either finished: they ran at the same time.
    const firstEnd = Math.min(...models.map((label) => run.stderr.indexOf(`[${label}] model ${label}: converged`)));
    for (const label of models) {
      expect(run.stderr.indexOf(`[${label}] model ${label}: `), run.stderr).toBeGreaterThanOrEqual(0);
      expect(run.stderr.indexOf(`[${label}] model ${label}: `)).toBeLessThan(firstEnd);
      expect(JSON.parse(readFileSync(join(out, label, 'run.json'), 'utf8')).run.worker_threads).toBe(1);
    }
    expectSameRuns(out, referenceOf('converged'), models);
  }, 120_000);

  it('fits them in turn with --in-turn or a budget of one thread', async () => {
    const { path: config, models } = CONFIGS.converged;
    const inTurn = await fit([config, '--in-turn', '--out', join(scratch, 'in-turn')]);
    expect(inTurn.code, inTurn.stderr).toBe(0);
    expect(inTurn.stderr).not.toContain('side by side');
    expect(inTurn.stderr).toContain('2 worker threads');
    const one = await fit([config, '--workers', '1', '--out', join(scratch, 'one-thread')]);
    expect(one.code, one.stderr).toBe(0);
    expect(one.stderr).not.toContain('side by side');
    expectSameRuns(join(scratch, 'in-turn'), referenceOf('converged'), models);
  }, 120_000);

  it('called in process from the TypeScript sources, starts the built command for each model', async () => {
    const { path: config, models } = CONFIGS.converged;
    const out = join(scratch, 'in-process');
    const run = await runCommandLine(['fit', config, '--out', out]);
    expect(run.code, run.stderr).toBe(0);
    expect(run.stderr).toContain('2 models side by side');
    for (const label of models) expect(run.stdout).toContain(`== ${label}: converged`);
    expectSameRuns(out, referenceOf('converged'), models);
  }, 120_000);

  it('exits 2 before any model starts when an output folder holds files, naming the folder and --force', async () => {
    const out = join(scratch, 'occupied');
    mkdirSync(join(out, 'flat_wcdm'), { recursive: true });
    writeFileSync(join(out, 'flat_wcdm', 'notes.txt'), 'mine\n');
    const run = await fit([CONFIGS.converged.path, '--out', out]);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain(join(out, 'flat_wcdm'));
    expect(run.stderr).toContain('--force');
    expect(run.stderr).not.toContain('side by side');
    expect(existsSync(join(out, 'flat_lcdm', 'checkpoint.bin'))).toBe(false);
  }, 60_000);

  const cases: Array<{ signal: NodeJS.Signals; toGroup: boolean }> = [
    { signal: 'SIGINT', toGroup: true },
    { signal: 'SIGTERM', toGroup: false },
  ];
  it.each(cases)('$signal (to the process group: $toGroup) stops both running models within a second, each writes its checkpoint and summaries, exit 130; --resume finishes all three', async ({ signal, toGroup }) => {
    const { path: config, models } = CONFIGS.max_steps;
    const out = join(scratch, `${signal}-${toGroup ? 'group' : 'process'}`);
    const dirs = models.map((label) => join(out, label));
    // Two models run at once on two threads, the third waits; the signal follows the checkpoint of step 100 of both.
    const interrupted = await runAndSignal(['fit', config, '--out', out], [signal], () => checkpointStep(dirs[0]) >= 100 && checkpointStep(dirs[1]) >= 100, { toGroup });
    expect(interrupted.killedBy, interrupted.stderr).toBeNull();
    expect(interrupted.code, interrupted.stderr).toBe(130);
    expect(interrupted.secondsToEachStop, interrupted.stderr).toHaveLength(2);
    for (const seconds of interrupted.secondsToEachStop) expect(seconds).toBeLessThan(STOP_DELAY_SECONDS);
    expect(interrupted.secondsAfterSignal as number).toBeLessThan(EXIT_DELAY_SECONDS);
    console.info(`${signal} to the ${toGroup ? 'group' : 'process'}: the models stopped ${interrupted.secondsToEachStop.map((s) => s.toFixed(2)).join(' and ')} s and the conductor exited ${(interrupted.secondsAfterSignal as number).toFixed(2)} s after the signal`);
    expect(interrupted.stderr).toMatch(/not started: curved_lcdm; continue with the same command and --resume/);
    expect(interrupted.stderr).not.toMatch(/internal error/);
    // The data warning both models give (the table's header names a column its rows lack) is printed once, as in turn.
    expect(interrupted.stderr.match(/the header names 19 columns/g), interrupted.stderr).toHaveLength(1);
    expect(temporaryFiles(out)).toEqual([]);
    for (const dir of dirs.slice(0, 2)) {
      expect(checkpointStep(dir)).toBe(stepsInRunRecord(dir));
      expect(stepsInRunRecord(dir)).toBeLessThan(1200);
      for (const file of ['chains.csv', 'summary.json', 'summary.md', 'table.tex']) expect(existsSync(join(dir, file)), file).toBe(true);
    }
    expect(existsSync(join(dirs[2], 'run.json'))).toBe(false);
    const resumed = await fit([config, '--out', out, '--resume', '--quiet']);
    expect(resumed.code, resumed.stderr).toBe(0);
    expectSameRuns(out, referenceOf('max_steps'), models);
  }, 180_000);

  it('ends every model and itself at once on a second SIGINT; the last checkpoints resume into the chains of a fit in turn', async () => {
    const { path: config, models } = CONFIGS.max_steps;
    const out = join(scratch, 'twice');
    const dirs = models.map((label) => join(out, label));
    // The second signal 100 ms after the first: while the models write their outputs (about a second under load).
    const run = await runAndSignal(['fit', config, '--out', out], ['SIGINT', 'SIGINT'], () => checkpointStep(dirs[0]) >= 100 && checkpointStep(dirs[1]) >= 100, { gapMs: 100 });
    // Ended by the second signal (the default action), or already finished writing when it came.
    expect(run.killedBy === 'SIGINT' || run.code === 130, `${run.code} ${run.killedBy}\n${run.stderr}`).toBe(true);
    expect(run.secondsAfterSignal as number).toBeLessThan(EXIT_DELAY_SECONDS);
    await new Promise((done) => setTimeout(done, 300));
    expect(processesNaming(out)).toEqual([]);
    for (const dir of dirs.slice(0, 2)) expect(checkpointStep(dir)).toBeGreaterThanOrEqual(100);
    const resumed = await fit([config, '--out', out, '--resume', '--quiet']);
    expect(resumed.code, resumed.stderr).toBe(0);
    expect(temporaryFiles(out)).toEqual([]);
    for (const label of models) {
      expect(readFileSync(join(out, label, 'chains.csv')).equals(readFileSync(join(referenceOf('max_steps'), label, 'chains.csv'))), label).toBe(true);
    }
  }, 120_000);
});

/**
 * A stand-in for a model's process (node -e): it reads its label after --model and behaves as `behaviour[label]`
 * says: ok (a line, then its report on standard output after 300 ms, exit 0), fail2 (an error line, exit 2), crash
 * (ended by SIGKILL), hold (waits; a stop signal makes it say so and exit 130), deaf (waits and ignores stop signals).
 */
function standIn(behaviour: Record<string, 'ok' | 'fail2' | 'crash' | 'hold' | 'deaf'>): string[] {
  const script = `const label = process.argv[process.argv.indexOf('--model') + 1];
const how = ${JSON.stringify(behaviour)}[label];
process.stderr.write('model ' + label + ': started with ' + process.argv.slice(process.argv.indexOf('--workers'), process.argv.indexOf('--workers') + 2).join(' ') + '\\n');
if (how === 'ok') setTimeout(() => process.stdout.write('== ' + label + ': done\\n'), 300);
if (how === 'fail2') { process.stderr.write('error: ' + label + ' cannot go on\\n'); process.exitCode = 2; }
if (how === 'crash') process.kill(process.pid, 'SIGKILL');
if (how === 'hold' || how === 'deaf') {
  setInterval(() => undefined, 1000);
  for (const name of ['SIGINT', 'SIGTERM']) process.on(name, () => { if (how === 'hold') { process.stderr.write(label + ' stopped on ' + name + '\\n'); process.exit(130); } });
}`;
  return [process.execPath, '-e', script];
}

describe('fitSideBySide (the conductor, with stand-in model processes)', () => {
  const plan = { slots: 2, threadsPerSlot: [1, 1] };
  const request = (name: string, launcher: string[], lines: string[]): SideBySideRequest => ({
    configPath: CONFIGS.max_steps.path, outDir: join(scratch, name), launcher, onLine: (line) => lines.push(line),
  });

  it('starts no further model after one fails, lets the running one finish, and exits with the failure\'s code', async () => {
    const lines: string[] = [];
    const reports: string[] = [];
    const outcome = await fitSideBySide({ ...request('stand-in-fail', standIn({ flat_lcdm: 'ok', flat_wcdm: 'fail2', curved_lcdm: 'ok' }), lines), onReport: (_label, text) => reports.push(text) }, plan);
    expect(outcome.models.map((model) => model.state)).toEqual(['finished', 'failed', 'not_started']);
    expect(outcome.exitCode).toBe(2);
    expect(lines).toContain('[flat_wcdm] error: flat_wcdm cannot go on');
    expect(lines).toContain('[flat_lcdm] model flat_lcdm: started with --workers 1');
    expect(reports).toEqual(['== flat_lcdm: done\n']);
  }, 60_000);

  it('counts a model ended by a signal nobody sent as an internal failure (exit 1)', async () => {
    const outcome = await fitSideBySide(request('stand-in-crash', standIn({ flat_lcdm: 'crash', flat_wcdm: 'ok', curved_lcdm: 'ok' }), []), plan);
    expect(outcome.models.map((model) => model.state)).toEqual(['failed', 'finished', 'not_started']);
    expect(outcome.models[0].endSignal).toBe('SIGKILL');
    expect(outcome.exitCode).toBe(1);
  }, 60_000);

  it('passes a stop on to every running model once, starts no waiting one, and exits 130', async () => {
    const lines: string[] = [];
    const stop = new AbortController();
    const running = fitSideBySide({ ...request('stand-in-stop', standIn({ flat_lcdm: 'hold', flat_wcdm: 'hold', curved_lcdm: 'ok' }), lines), stop: stop.signal }, plan);
    while (lines.filter((line) => line.includes('started with')).length < 2) await new Promise((done) => setTimeout(done, 20));
    await new Promise((done) => setTimeout(done, 200)); // their signal handlers are installed by now
    stop.abort('SIGTERM');
    const outcome = await running;
    expect(outcome.models.map((model) => model.state)).toEqual(['interrupted', 'interrupted', 'not_started']);
    expect(lines).toContain('[flat_lcdm] flat_lcdm stopped on SIGTERM');
    expect(lines).toContain('[flat_wcdm] flat_wcdm stopped on SIGTERM');
    expect(outcome.exitCode).toBe(130);
  }, 60_000);

  it('ends at once, on a second signal, a model that does not stop on the first', async () => {
    const lines: string[] = [];
    const stop = new AbortController();
    const leave = new AbortController();
    const running = fitSideBySide({ ...request('stand-in-leave', standIn({ flat_lcdm: 'deaf', flat_wcdm: 'deaf', curved_lcdm: 'ok' }), lines), stop: stop.signal, leave: leave.signal }, plan);
    while (lines.filter((line) => line.includes('started with')).length < 2) await new Promise((done) => setTimeout(done, 20));
    await new Promise((done) => setTimeout(done, 200));
    stop.abort('SIGINT');
    await new Promise((done) => setTimeout(done, 300));
    const left = Date.now();
    leave.abort('SIGINT');
    const outcome = await running;
    expect((Date.now() - left) / 1000).toBeLessThan(EXIT_DELAY_SECONDS);
    expect(outcome.models.map((model) => [model.state, model.endSignal])).toEqual([['interrupted', 'SIGKILL'], ['interrupted', 'SIGKILL'], ['not_started', null]]);
    expect(outcome.exitCode).toBe(130);
  }, 60_000);
});
