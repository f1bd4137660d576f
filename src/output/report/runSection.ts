import { escapeXml } from '../figures/index.js';
import { formatWallTime } from './formatWallTime.js';
import { htmlElement } from './htmlElement.js';
import type { ReportRunFacts } from './reportInput.js';

/**
 * The "Run" section: seed, steps, walkers and ensembles, stop reason, wall
 * time, model, start time, version and any extra facts, as a definition list.
 *
 * @param facts the run facts (steps in steps, wall time in s)
 * @returns a `<section id="run">` element
 * @example runSection({ seed: 7, steps: 4000, stopReason: 'converged', wallTimeSeconds: 61, version: '0.1.0' })
 */
export function runSection(facts: ReportRunFacts): string {
  const pairs: [string, string][] = [['seed', String(facts.seed)], ['steps per walker', String(facts.steps)]];
  if (facts.walkers !== undefined) pairs.push(['walkers per ensemble', String(facts.walkers)]);
  if (facts.ensembles !== undefined) pairs.push(['ensembles', String(facts.ensembles)]);
  pairs.push(['stopped because', facts.stopReason], ['wall time', formatWallTime(facts.wallTimeSeconds)]);
  if (facts.model !== undefined) pairs.push(['model', facts.model]);
  if (facts.startedAt !== undefined) pairs.push(['started', facts.startedAt]);
  pairs.push(['candela version', facts.version]);
  for (const extra of facts.extra ?? []) pairs.push([extra.label, extra.value]);
  const items = pairs.flatMap(([term, value]) => [htmlElement('dt', {}, escapeXml(term)), htmlElement('dd', {}, escapeXml(value))]);
  return htmlElement('section', { id: 'run' }, [htmlElement('h2', {}, 'Run'), '\n', htmlElement('dl', { class: 'facts' }, items.join('\n')), '\n']);
}
