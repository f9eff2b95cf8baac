/**
 * A deterministic generator of hostile JSON requests. Each case starts from a valid body for the
 * route and breaks it one way: wrong types, missing or extra fields, huge strings, deep nesting,
 * prototype keys, non-finite and out-of-range numbers, control characters, arrays for objects,
 * empty or invalid JSON, wrong content types. Same seed, same requests, same order.
 */
import { mulberry32 } from "../../scripts/seeded-random";

/** Text written into the JSON verbatim (e.g. `1e999`, which JSON.stringify cannot produce). */
export class Raw {
  constructor(readonly text: string) {}
}

export type FuzzCase = {
  kind: string;
  /** The body as sent; undefined sends none. */
  text?: string;
  contentType?: string | null;
  headers?: Record<string, string>;
  /** The parsed value, when there is one (used to recognise known cases). */
  value?: unknown;
};

export function seeded(seed: number) {
  const next = mulberry32(seed);
  const int = (n: number) => Math.floor(next() * n);
  const pick = <T>(list: readonly T[]): T => list[int(list.length)];
  return { next, int, pick };
}
export type Rng = ReturnType<typeof seeded>;

/** JSON text of a value that may hold Raw pieces and own `__proto__` keys. */
export function toJson(value: unknown): string {
  if (value instanceof Raw) return value.text;
  if (Array.isArray(value)) return `[${value.map(toJson).join(",")}]`;
  if (value && typeof value === "object") {
    return `{${Object.keys(value)
      .map((k) => `${JSON.stringify(k)}:${toJson((value as Record<string, unknown>)[k])}`)
      .join(",")}}`;
  }
  return JSON.stringify(value) ?? "null";
}

const MB = 1024 * 1024;
const deep = (depth: number) => new Raw(`${"[".repeat(depth)}1${"]".repeat(depth)}`);
const deepObject = (depth: number) => new Raw(`${'{"a":'.repeat(depth)}1${"}".repeat(depth)}`);
const proto = (inner: unknown) => {
  const o: Record<string, unknown> = {};
  Object.defineProperty(o, "__proto__", { value: inner, enumerable: true, configurable: true, writable: true });
  return o;
};

/** Values that do not belong anywhere in a body, with a name for the tally. */
export const HOSTILE: [string, () => unknown][] = [
  ["null", () => null],
  ["true", () => true],
  ["zero", () => 0],
  ["negative", () => -1],
  ["fraction", () => 1.5],
  ["unsafe-integer", () => 2 ** 53 + 2],
  ["huge-finite", () => 1e308],
  ["tiny", () => 5e-324],
  ["raw-1e999", () => new Raw("1e999")],
  ["raw-minus-1e999", () => new Raw("-1e999")],
  ["raw-minus-zero", () => new Raw("-0")],
  ["string-Infinity", () => "Infinity"],
  ["string-NaN", () => "NaN"],
  ["string-1e999", () => "1e999"],
  ["numeric-string", () => "42"],
  ["empty-string", () => ""],
  ["whitespace", () => " \t\n "],
  ["control-chars", () => "a\u0000b\u0007c\u001bd\u007f"],
  ["bidi-override", () => "\u202eevil\u202c"],
  ["lone-surrogate", () => new Raw('"\\ud800x\\udfff"')],
  ["bom-zero-width", () => "\ufeff\u200b\u200d"],
  ["emoji", () => "🏃‍♀️💨".repeat(40)],
  ["combining", () => `a${"\u0301".repeat(10_000)}`],
  ["html", () => "<script>alert(1)</script>"],
  ["sql", () => "'); DROP TABLE results; --"],
  ["huge-string-1mb", () => "x".repeat(MB)],
  ["empty-array", () => []],
  ["array-of-junk", () => [null, "a", {}, [], 1e308]],
  ["deep-array", () => deep(10_000)],
  ["deep-object", () => deepObject(2_000)],
  ["empty-object", () => ({})],
  ["proto-object", () => proto({ polluted: true, organizationId: 2, role: "owner" })],
  ["constructor-prototype", () => ({ constructor: { prototype: { polluted: true } } })],
];

const EXTRA_KEYS: [string, () => Record<string, unknown>][] = [
  ["extra-organizationId", () => ({ organizationId: 2 })],
  ["extra-id-version", () => ({ id: 1, version: 999, createdBy: 1 })],
  ["extra-role", () => ({ role: "owner", isAdmin: true })],
  ["extra-__proto__", () => proto({ polluted: true, organizationId: 2 })],
  ["extra-constructor", () => ({ constructor: { prototype: { polluted: true } } })],
  ["extra-prototype", () => ({ prototype: { polluted: true } })],
];

type Path = (string | number)[];

/** Every path to a value inside `value` (objects and arrays), the root excluded. */
function pathsOf(value: unknown, prefix: Path = []): Path[] {
  if (value === null || typeof value !== "object" || value instanceof Raw) return [];
  const entries = Array.isArray(value) ? value.map((v, i) => [i, v] as const) : Object.entries(value);
  return entries.flatMap(([k, v]) => [[...prefix, k], ...pathsOf(v, [...prefix, k])]);
}

const clone = <T>(value: T): T => structuredClone(value);

function setAt(root: unknown, path: Path, value: unknown | typeof REMOVE): void {
  let node = root as Record<string | number, unknown>;
  for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
  const last = path[path.length - 1];
  if (value === REMOVE) {
    if (Array.isArray(node)) node.splice(last as number, 1);
    else delete node[last];
  } else node[last] = value;
}
const REMOVE = Symbol("remove");

const json = (kind: string, value: unknown, extra: Partial<FuzzCase> = {}): FuzzCase => ({
  kind,
  text: toJson(value),
  contentType: "application/json",
  value,
  ...extra,
});

/** Every hostile value once, each at a random place in `base`. */
export function sweep(base: Record<string, unknown>, rng: Rng): FuzzCase[] {
  const paths = pathsOf(base);
  return HOSTILE.map(([name, make]) => {
    const path = rng.pick(paths);
    const body = clone(base);
    setAt(body, path, make());
    return json(`${name} at ${path.join(".")}`, body);
  });
}

/** One hostile request derived from `base` (a valid body). */
export function mutate(base: Record<string, unknown>, rng: Rng): FuzzCase {
  const paths = pathsOf(base);
  const path = paths.length ? rng.pick(paths) : undefined;
  const where = path ? path.join(".") : "body";
  const roll = rng.int(20);
  if (roll <= 6 && path) {
    const [name, make] = rng.pick(HOSTILE);
    const body = clone(base);
    setAt(body, path, make());
    return json(`${name} at ${where}`, body);
  }
  if (roll <= 8 && path) {
    const body = clone(base);
    setAt(body, path, REMOVE);
    return json(`missing ${where}`, body);
  }
  if (roll <= 10) {
    const [name, make] = rng.pick(EXTRA_KEYS);
    const body = clone(base);
    const target =
      path && typeof getAt(body, path.slice(0, -1)) === "object" && !Array.isArray(getAt(body, path.slice(0, -1)))
        ? path.slice(0, -1)
        : [];
    // defineProperty, not assignment: `__proto__` must become an own key, as JSON.parse makes it.
    const extra = make();
    for (const k of Object.keys(extra))
      Object.defineProperty(getAt(body, target), k, {
        value: extra[k],
        enumerable: true,
        configurable: true,
        writable: true,
      });
    return json(`${name} at ${target.join(".") || "body"}`, body);
  }
  if (roll === 11 && path) {
    // An array where an object (or a single value) is expected, and the other way round.
    const body = clone(base);
    const current = getAt(body, path);
    setAt(body, path, Array.isArray(current) ? { 0: current[0] } : [current]);
    return json(`wrapped ${where}`, body);
  }
  if (roll === 12) return json("array-for-object", rng.pick([[base], [], [[base]]]));
  if (roll === 13) return json("scalar-body", rng.pick<unknown>([null, 42, "body", true, new Raw("1e999")]));
  if (roll === 14) return { kind: "empty-body", text: undefined, contentType: "application/json" };
  if (roll === 15) {
    const good = toJson(base);
    const broken = rng.pick([
      good.slice(0, Math.max(1, rng.int(good.length))),
      `${good},`,
      good.replace(/"/g, "'"),
      `${good}}`,
      "NaN",
      "undefined",
      "{",
      `\ufeff${good}`,
      good.replace(":", ': NaN, "x":'),
      "",
    ]);
    return { kind: "invalid-json", text: broken, contentType: "application/json" };
  }
  if (roll === 16) {
    const contentType = rng.pick<string | null>([
      null,
      "text/plain",
      "application/x-www-form-urlencoded",
      "multipart/form-data; boundary=x",
      "application/xml",
      "application/jso",
    ]);
    return { kind: `content-type ${contentType ?? "(none)"}`, text: toJson(base), contentType, value: base };
  }
  if (roll === 17) {
    const body = clone(base);
    Object.assign(body, { padding: "y".repeat(2 * MB + 10) });
    return json("oversized-body", body);
  }
  if (roll === 18) return json("cross-site-origin", clone(base), { headers: { origin: "https://elsewhere.example" } });
  return json("valid", clone(base));
}

function getAt(root: unknown, path: Path): unknown {
  let node = root as Record<string | number, unknown>;
  for (const key of path) node = node[key] as Record<string | number, unknown>;
  return node;
}
