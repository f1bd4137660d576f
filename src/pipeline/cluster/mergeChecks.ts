import { isAbsolute, join, relative, resolve, sep } from 'node:path';
import { CandelaError, type Issue } from '../../errors.js';
import type { SamplerSnapshot } from '../../sampler/index.js';
import { drawsFromChainRecord, drawsInMemory, readCheckpointState, recordShapeOf, type StoredDraws } from '../../output/index.js';
import { RUN_FILES } from '../../output/index.js';
import type { RunRecord } from '../run/runRecord.js';
import { readRunRecord, type StoredRunRecord } from '../run/runFiles.js';
import type { PartFacts } from './slurmPart.js';

/** run.json of a part folder. */
export type PartRecord = RunRecord & { part: PartFacts };

/** A finished part folder read back for merging. */
export interface PartOnDisk {
  dir: string;
  record: PartRecord;
  /** The sampler state of the part's checkpoint, without its chain (chainFirstStep = stepCount; the steps are in the part's chain record). */
  snapshot: SamplerSnapshot;
  /** The part's stored steps, read from its chain record a block at a time (bit for bit as sampled). */
  draws: StoredDraws;
  wallSeconds: number;
  evaluations: number;
}

function readPart(dir: string, issues: Issue[]): PartOnDisk | null {
  const runPath = join(dir, RUN_FILES.run);
  let record: PartRecord;
  try {
    record = readRunRecord<StoredRunRecord & PartRecord>(dir);
  } catch {
    issues.push({ code: 'merge.no_record', file: runPath, message: `${dir} holds no readable run.json`, fix: 'give the folders written by `candela fit CONFIG --part I` (under <out>/parts/<model>/ensemble-<k>)' });
    return null;
  }
  if (!record.part || !Number.isInteger(record.part.ensemble)) {
    issues.push({ code: 'merge.not_a_part', file: runPath, message: `${dir} is not a part folder (its run.json has no part section)`, fix: 'give the folders written by `candela fit CONFIG --part I`' });
    return null;
  }
  const checkpointPath = join(dir, RUN_FILES.checkpoint);
  try {
    const saved = readCheckpointState(dir);
    const snapshot = saved.snapshot;
    // A part whose checkpoint still holds its chain (written before the chain record existed) is read from memory.
    const draws = saved.earlierSteps ? drawsFromChainRecord(dir, recordShapeOf(snapshot), snapshot.stepCount) : drawsInMemory(snapshot.ensembles.map((ensemble) => ({
      steps: snapshot.stepCount, walkers: snapshot.options.walkers, dimension: snapshot.options.dimension, blobCount: snapshot.blobCount,
      positions: ensemble.chainPositions, logProb: ensemble.chainLogProb, blobs: ensemble.chainBlobs,
    })));
    return { dir, record, snapshot, draws, wallSeconds: saved.wallSeconds, evaluations: saved.evaluations };
  } catch {
    issues.push({ code: 'merge.no_checkpoint', file: checkpointPath, message: `${dir} has no readable checkpoint.bin and chain-record.bin, which hold the part's sampler state and exact chain`, fix: 'rerun the part with `candela fit CONFIG --part I --resume` (or without --resume, with --force)' });
    return null;
  }
}

/**
 * Reads part folders and checks that they can be merged into one run: each
 * holds run.json with a `part` section and checkpoint.bin; all share the
 * model, the seed, the resolved configuration and every input's SHA-256;
 * no two hold the same ensemble; the output folder is none of them and
 * contains none of them (preparing it with --force would delete them).
 * Every problem is collected, each naming the folder at fault.
 *
 * Cost: reading each part's run.json and checkpoint state (the chains stay on disk, read later a block at a time).
 * @param dirs part folders.
 * @param outDir the merged run folder.
 * @returns the parts, sorted by their original ensemble index.
 * @throws CandelaError `merge.no_parts`, `merge.no_record`, `merge.not_a_part`, `merge.no_checkpoint`,
 *   `merge.model_differs`, `merge.seed_differs`, `merge.configuration_differs`, `merge.inputs_differ`,
 *   `merge.duplicate_ensemble`, `merge.out_holds_parts`.
 * @example readPartsForMerge(['out/parts/flat_lcdm/ensemble-0', 'out/parts/flat_lcdm/ensemble-1'], 'out/flat_lcdm').length // 2
 */
export function readPartsForMerge(dirs: readonly string[], outDir: string): PartOnDisk[] {
  if (dirs.length === 0) throw new CandelaError({ code: 'merge.no_parts', message: 'no part folder was given', fix: 'list the part folders of one model, e.g. out/parts/flat_lcdm/ensemble-*' });
  const issues: Issue[] = [];
  const target = resolve(outDir);
  for (const dir of dirs) {
    const fromTarget = relative(target, resolve(dir));
    const outside = fromTarget === '..' || fromTarget.startsWith(`..${sep}`) || isAbsolute(fromTarget);
    if (!outside) {
      issues.push({ code: 'merge.out_holds_parts', file: outDir, message: `the merged folder ${outDir} is or contains the part folder ${dir}`, fix: 'merge into another folder, e.g. <out>/<model label>' });
    }
  }
  const parts = dirs.map((dir) => readPart(dir, issues)).filter((part): part is PartOnDisk => part !== null);
  if (issues.length > 0) throw new CandelaError(issues);
  const first = parts[0];
  const configuration = JSON.stringify(first.record.configuration);
  const inputs = JSON.stringify(first.record.inputs.map((input) => input.sha256));
  const owner = new Map<number, string>();
  for (const part of parts) {
    const { record, dir } = part;
    const file = join(dir, RUN_FILES.run);
    const against = `than ${first.dir}`;
    if (record.model.label !== first.record.model.label) issues.push({ code: 'merge.model_differs', file, message: `${dir} holds model ${record.model.label}, another model ${against} (${first.record.model.label})`, fix: 'merge the parts of one model at a time' });
    if (record.run.seed !== first.record.run.seed) issues.push({ code: 'merge.seed_differs', file, message: `${dir} was sampled with seed ${record.run.seed}, another seed ${against} (${first.record.run.seed})`, fix: 'merge only parts of one run (same configuration and seed)' });
    else if (JSON.stringify(record.configuration) !== configuration) issues.push({ code: 'merge.configuration_differs', file, message: `${dir} was sampled with another resolved configuration ${against}`, fix: 'merge only parts of one run (same configuration and seed)' });
    if (JSON.stringify(record.inputs.map((input) => input.sha256)) !== inputs) issues.push({ code: 'merge.inputs_differ', file, message: `the SHA-256 of ${dir}'s input files differ from those of ${first.dir}`, fix: 'the configuration or data changed between the parts; rerun the parts from the same files' });
    const holder = owner.get(record.part.ensemble);
    if (holder !== undefined) issues.push({ code: 'merge.duplicate_ensemble', file, message: `${dir} and ${holder} both hold ensemble ${record.part.ensemble}`, fix: 'give each ensemble once' });
    else owner.set(record.part.ensemble, dir);
  }
  if (issues.length > 0) throw new CandelaError(issues);
  return [...parts].sort((a, b) => a.record.part.ensemble - b.record.part.ensemble);
}
