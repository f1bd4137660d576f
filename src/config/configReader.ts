/**
 * Walks a parsed YAML document key by key, turning nodes into typed values
 * and collecting every problem (with line, column and key path) instead of
 * stopping at the first. Section readers (readSampler.ts, ...) are built on it.
 */
import { isAlias, isMap, isScalar, isSeq } from 'yaml';
import type { Document, LineCounter, Node } from 'yaml';
import type { Issue } from '../errors.js';
import { closestWord } from '../math/index.js';
import type { SourcePosition } from './candelaConfig.js';
import { numberRuleText } from './numberRule.js';
import type { NumberRule } from './numberRule.js';

/** A value in the document: its node (null when the key is absent), key path, and a node to point at when it is absent. */
export interface Located {
  node: Node | null;
  path: string;
  anchor: Node | null;
}

/** The extra fields of an issue besides code, message, path and position. */
export type IssueDetails = Pick<Issue, 'expected' | 'found' | 'fix' | 'severity'>;

/** Reads one configuration document; `issues` collects every problem found. */
export class ConfigReader {
  readonly issues: Issue[] = [];
  readonly positions: Record<string, SourcePosition> = {};

  /**
   * @param document the parsed document (yaml's parseDocument).
   * @param lineCounter the LineCounter given to parseDocument, for line:column.
   * @param fileName the configuration file as the user named it, for messages.
   */
  constructor(
    private readonly document: Document,
    private readonly lineCounter: LineCounter,
    readonly fileName: string,
  ) {}

  /** The document's top-level value. */
  root(): Located {
    return { node: this.follow(this.document.contents as Node | null), path: '', anchor: null };
  }

  /** 1-based line and column of a character offset. */
  positionOf(offset: number): SourcePosition {
    const { line, col } = this.lineCounter.linePos(offset);
    return { line, column: col };
  }

  /** Records a problem at a value (or at its anchor when absent). */
  report(at: Located, code: string, message: string, details: IssueDetails = {}): void {
    const node = at.node ?? at.anchor;
    this.push(node?.range ? this.positionOf(node.range[0]) : { line: 1, column: 1 }, at.path, code, message, details);
  }

  /**
   * Records a problem at a key path already read (cross-field rules): at the
   * position of that path, or of its nearest ancestor that the file contains.
   */
  reportAtPath(path: string, code: string, message: string, details: IssueDetails = {}): void {
    let probe = path;
    while (probe && !this.positions[probe]) {
      const parent = probe.replace(/(\.[^.[\]]*|\[\d+\])$/, '');
      probe = parent === probe ? '' : parent;
    }
    this.push(this.positions[probe] ?? { line: 1, column: 1 }, path, code, message, details);
  }

  private push(position: SourcePosition, path: string, code: string, message: string, details: IssueDetails): void {
    const given = Object.fromEntries(Object.entries(details).filter(([, value]) => value !== undefined)) as IssueDetails;
    this.issues.push({ code, message, file: this.fileName, ...position, path: path || '(top level)', ...given });
  }

  /** True when an error (not a warning) was reported at `path` or below it. */
  failedAt(path: string): boolean {
    return this.issues.some((issue) => issue.severity !== 'warning' && issue.path !== undefined &&
      (issue.path === path || issue.path.startsWith(`${path}.`) || issue.path.startsWith(`${path}[`)));
  }

  /** The value as the user wrote it, in words, for the `found` part of a message. */
  describe(node: Node | null): string {
    if (node === null) return 'nothing';
    if (isMap(node)) return 'a mapping (key: value lines)';
    if (isSeq(node)) return 'a list';
    if (isScalar(node)) {
      if (node.value === null || node.value === undefined) return 'an empty value';
      if (typeof node.value === 'string') return `"${node.value}"`;
      return node.source ?? String(node.value);
    }
    return 'an unsupported YAML value';
  }

  /**
   * The keys of a mapping, as located values. Reports a value that is not a
   * mapping, each unknown key (with the closest valid key) and each missing
   * required key. Returns null when the value is absent or not a mapping.
   * `allowed: null` accepts any key (the caller checks them).
   */
  mapping(at: Located | undefined, allowed: readonly string[] | null, required: readonly string[] = []): Map<string, Located> | null {
    if (!at) return null;
    if (at.node === null || this.isEmpty(at.node)) {
      for (const key of required) this.missing({ node: null, path: join(at.path, key), anchor: at.node ?? at.anchor }, key);
      return null;
    }
    if (!isMap(at.node)) {
      this.report(at, 'config.wrong_type', at.path ? 'must be a mapping of keys to values' : 'the file must be a mapping of keys to values', {
        expected: allowed ? `a mapping with keys such as ${allowed.slice(0, 3).join(', ')}` : 'a mapping of names to values', found: this.describe(at.node),
        fix: 'write one "key: value" per line, indented under the parent key',
      });
      return null;
    }
    const fields = new Map<string, Located>();
    for (const pair of at.node.items) {
      const keyNode = this.follow(pair.key as Node | null);
      const key = keyNode && isScalar(keyNode) ? String(keyNode.value) : null;
      const keyAt: Located = { node: keyNode, path: join(at.path, key ?? '?'), anchor: at.node };
      if (key === null) {
        this.report(keyAt, 'config.bad_key', 'a key must be plain text', { found: this.describe(keyNode), fix: 'use a plain word as the key' });
        continue;
      }
      if (allowed && !allowed.includes(key)) {
        this.unknownKey(keyAt, key, allowed);
        continue;
      }
      this.remember(keyAt.path, keyNode);
      fields.set(key, { node: this.follow(pair.value as Node | null), path: keyAt.path, anchor: keyNode });
    }
    for (const key of required) {
      if (!fields.has(key)) this.missing({ node: null, path: join(at.path, key), anchor: at.node }, key);
    }
    return fields;
  }

  /** Reports an unknown key with the closest valid one. */
  unknownKey(at: Located, key: string, allowed: readonly string[], what = 'key'): void {
    const suggestion = closestWord(key, allowed);
    this.report(at, 'config.unknown_key', `unknown ${what} "${key}"`, {
      expected: `one of ${allowed.join(', ')}`,
      found: `"${key}"`,
      fix: suggestion ? `did you mean "${suggestion}"?` : `remove "${key}" or use one of the keys listed`,
    });
  }

  /** Reports a required key that is absent. */
  missing(at: Located, key: string): void {
    this.report(at, 'config.missing_key', `required key "${key}" is missing`, {
      expected: `a value for ${at.path}`, found: 'nothing', fix: `add "${key}: ..." (see docs/configuration.md)`,
    });
  }

  /** The items of a list; a single scalar counts as a one-item list. Null when absent or invalid. */
  list(at: Located | undefined): Located[] | null {
    if (!at || at.node === null) return null;
    if (isScalar(at.node) && at.node.value !== null) return [at];
    if (!isSeq(at.node)) {
      this.report(at, 'config.wrong_type', 'must be a list', {
        expected: 'a list ("- item" lines or [a, b])', found: this.describe(at.node), fix: 'write the items as a YAML list',
      });
      return null;
    }
    return at.node.items.map((item, index) => {
      const node = this.follow(item as Node | null);
      const path = `${at.path}[${index}]`;
      this.remember(path, node);
      return { node, path, anchor: at.node };
    });
  }

  /** A finite number obeying `rule`, or undefined (absent or invalid; invalid is reported). */
  number(at: Located | undefined, rule: NumberRule = {}): number | undefined {
    if (!at || at.node === null) return undefined;
    const expected = numberRuleText(rule);
    const value = isScalar(at.node) ? at.node.value : undefined;
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      const quoted = typeof value === 'string' && value.trim() !== '' && Number.isFinite(Number(value));
      this.report(at, 'config.wrong_type', `must be ${expected}`, {
        expected, found: this.describe(at.node),
        fix: quoted ? 'remove the quotes around the number' : rule.fix ?? `write ${expected}`,
      });
      return undefined;
    }
    const tooLow = rule.min !== undefined && (rule.exclusiveMin ? value <= rule.min : value < rule.min);
    const tooHigh = rule.max !== undefined && (rule.exclusiveMax ? value >= rule.max : value > rule.max);
    if ((rule.integer && !Number.isInteger(value)) || tooLow || tooHigh) {
      this.report(at, 'config.out_of_range', 'out of range', {
        expected, found: this.describe(at.node), fix: rule.fix ?? `set ${at.path} to ${expected}`,
      });
      return undefined;
    }
    return value;
  }

  /** Text (numbers and booleans are not accepted), or undefined. `nullable`: an empty value or `null` gives null. */
  text(at: Located | undefined, options: { nullable?: boolean; numbersAsText?: boolean } = {}): string | null | undefined {
    if (!at || at.node === null) return undefined;
    const value = isScalar(at.node) ? at.node.value : undefined;
    if (value === null && options.nullable) return null;
    if (typeof value === 'string' && value !== '') return value;
    if (typeof value === 'number' && options.numbersAsText && isScalar(at.node)) return at.node.source ?? String(value);
    this.report(at, 'config.wrong_type', 'must be text', {
      expected: options.nullable ? 'text or null' : 'non-empty text', found: this.describe(at.node),
      fix: 'write the text, in quotes if it looks like a number or a boolean',
    });
    return undefined;
  }

  /** true / false, or undefined. */
  boolean(at: Located | undefined): boolean | undefined {
    if (!at || at.node === null) return undefined;
    const value = isScalar(at.node) ? at.node.value : undefined;
    if (typeof value === 'boolean') return value;
    this.report(at, 'config.wrong_type', 'must be true or false', {
      expected: 'true or false', found: this.describe(at.node), fix: `write ${at.path.split('.').pop()}: true (or false)`,
    });
    return undefined;
  }

  /** One of a fixed set of words, or undefined (unknown words get "did you mean"). */
  choice<T extends string>(at: Located | undefined, choices: readonly T[]): T | undefined {
    if (!at || at.node === null) return undefined;
    const value = isScalar(at.node) ? at.node.value : undefined;
    if (typeof value === 'string' && (choices as readonly string[]).includes(value)) return value as T;
    const suggestion = typeof value === 'string' ? closestWord(value, choices) : null;
    this.report(at, 'config.unknown_value', 'unknown value', {
      expected: `one of ${choices.join(', ')}`, found: this.describe(at.node),
      fix: suggestion ? `did you mean "${suggestion}"?` : `write one of ${choices.join(', ')}`,
    });
    return undefined;
  }

  /** Remembers where a key path sits, for later stages' messages. */
  remember(path: string, node: Node | null): void {
    if (node?.range) this.positions[path] = this.positionOf(node.range[0]);
  }

  private isEmpty(node: Node): boolean {
    return isScalar(node) && (node.value === null || node.value === undefined);
  }

  private follow(node: Node | null | undefined): Node | null {
    if (node === null || node === undefined) return null;
    return isAlias(node) ? ((node.resolve(this.document) as Node | undefined) ?? null) : node;
  }
}

/** `a.b` or `b` when the parent is the top level. */
export function join(parent: string, key: string): string {
  return parent ? `${parent}.${key}` : key;
}
