/**
 * A seeded generator of malformed CSV uploads: wrong encodings, binary noise, floods of blank
 * lines, one-line files, huge and unclosed fields, formula cells, numbers no score can be,
 * very wide headers, duplicate headers, NUL bytes. The same seed gives the same files, so a
 * failure can be replayed.
 */
import { mulberry32 } from "../../scripts/seeded-random";
export type HostileFile = { kind: string; bytes: Uint8Array };

/** mulberry32: small, fast, good enough to pick shapes. */
export function seeded(seed: number) {
  const next = mulberry32(seed);
  const int = (min: number, max: number) => min + Math.floor(next() * (max - min + 1));
  const pick = <T>(items: readonly T[]) => items[Math.floor(next() * items.length)];
  return { next, int, pick };
}

type Random = ReturnType<typeof seeded>;

const utf8 = (text: string) => new TextEncoder().encode(text);
const latin1 = (text: string) => Uint8Array.from(text, (c) => c.charCodeAt(0) & 0xff);
function utf16(text: string, bigEndian: boolean, bom: boolean) {
  const units = (bom ? "\uFEFF" : "") + text;
  const out = new Uint8Array(units.length * 2);
  for (let i = 0; i < units.length; i++) {
    const u = units.charCodeAt(i);
    out[2 * i + (bigEndian ? 1 : 0)] = u & 0xff;
    out[2 * i + (bigEndian ? 0 : 1)] = u >> 8;
  }
  return out;
}

const ATHLETES = [
  "NHA001",
  "NHA002",
  "NHA003",
  "NHA004",
  "Jonah Pellegrini",
  "Callum Adeyemi",
  "Zed Unknown",
  "=cmd|' /C calc'!A0",
  "",
];
const TESTS = [
  "Countermovement jump",
  "10 m sprint",
  "30 m sprint",
  "Back squat 1RM",
  "Intermittent recovery run (level 1)",
  "Broad jump",
  "",
];
const FORMULAS = [
  '=HYPERLINK("http://example.invalid/x","click")',
  "=1+1",
  "+SUM(A1:A9)",
  "-2+3",
  "@SUM(1)",
  "=cmd|' /C calc'!A0",
  '"=IMPORTXML(A1,""//a"")"',
];
const NUMBERS = [
  "1e308",
  "-1e308",
  `1${"0".repeat(400)}`,
  `-1${"0".repeat(308)}`,
  `1${"0".repeat(308)}`,
  "NaN",
  "Infinity",
  "-Infinity",
  "∞",
  "-∞",
  "1e-400",
  "0x1F",
  "1_000",
  "1,5",
  "1.5.5",
  "٣٤",
  "４２",
  "1000000001",
  "-0",
  "0.000000000000000000001",
  "999999999.99",
  "41.2",
  "1.83",
  "",
];
const DELIMITERS = [",", ";", "\t", "|"];

function cell(r: Random): string {
  const k = r.int(0, 9);
  if (k < 3) return r.pick(NUMBERS);
  if (k < 5) return r.pick(FORMULAS);
  if (k < 7) return r.pick(ATHLETES);
  if (k < 9) return r.pick(TESTS);
  return String.fromCharCode(...Array.from({ length: r.int(0, 12) }, () => r.int(1, 0x2fff)));
}

function longFile(r: Random, rows: number, delimiter = ",") {
  const lines = [["athlete", "test", "trial", "value"].join(delimiter)];
  for (let i = 0; i < rows; i++) {
    lines.push(
      [r.pick(ATHLETES), r.pick(TESTS), String(r.int(0, 4)), r.next() < 0.5 ? r.pick(NUMBERS) : cell(r)].join(
        delimiter,
      ),
    );
  }
  return lines.join(r.pick(["\n", "\r\n", "\r"]));
}

function wideFile(r: Random, columns: number, rows: number) {
  const headers = [
    "athlete",
    ...Array.from({ length: columns }, (_, i) => (r.next() < 0.3 ? r.pick(TESTS) : `${r.pick(TESTS)} ${(i % 4) + 1}`)),
  ];
  const lines = [headers.join(",")];
  for (let i = 0; i < rows; i++)
    lines.push([r.pick(ATHLETES), ...Array.from({ length: columns }, () => r.pick(NUMBERS))].join(","));
  return lines.join("\n");
}

/** Byte-level damage to an otherwise plausible file. */
function mutate(r: Random, bytes: Uint8Array) {
  const out = Array.from(bytes);
  for (let k = r.int(1, 8); k > 0 && out.length > 0; k--) {
    const at = r.int(0, out.length - 1);
    const op = r.int(0, 3);
    if (op === 0) out.splice(at, 1);
    else if (op === 1) out.splice(at, 0, r.pick([0x22, 0x2c, 0x3b, 0x0a, 0x0d, 0x00, 0xff, 0xc3, 0x09]));
    else if (op === 2) out[at] = r.int(0, 255);
    else out.splice(at, 0, ...utf8(r.pick(FORMULAS)));
  }
  return Uint8Array.from(out);
}

const KINDS: [string, (r: Random) => Uint8Array][] = [
  ["random bytes", (r) => Uint8Array.from({ length: r.int(1, 3000) }, () => r.int(0, 255))],
  [
    "random printable text",
    (r) => utf8(Array.from({ length: r.int(1, 3000) }, () => String.fromCharCode(r.int(32, 126))).join("")),
  ],
  ["UTF-16 LE with BOM", (r) => utf16(longFile(r, r.int(1, 20)), false, true)],
  ["UTF-16 BE with BOM", (r) => utf16(longFile(r, r.int(1, 20)), true, true)],
  ["UTF-16 LE without BOM", (r) => utf16(longFile(r, r.int(1, 20)), false, false)],
  [
    "Latin-1",
    (r) =>
      latin1(
        `athlete;test;trial;value\nJosé Müller;Countermovement jump;1;${r.int(20, 60)},5\nÅsa Ødegård;10 m sprint;1;1,8\n`,
      ),
  ],
  ["UTF-8 BOM twice", (r) => utf8(`\uFEFF\uFEFF${longFile(r, r.int(1, 10))}`)],
  [
    "blank-line flood",
    (r) =>
      utf8(`${r.pick(["\n", "\r\n", "\r", " \n", ",,,\n"]).repeat(r.int(100, 20_000))}${longFile(r, r.int(0, 5))}`),
  ],
  [
    "one line, no line break",
    (r) => utf8(Array.from({ length: r.int(1, 2000) }, () => cell(r)).join(r.pick(DELIMITERS))),
  ],
  [
    "huge field",
    (r) =>
      utf8(
        `athlete,test,trial,value\nNHA001,${r.next() < 0.5 ? `"${"x,\n".repeat(r.int(1000, 20_000))}"` : "y".repeat(r.int(1000, 60_000))},1,40\n`,
      ),
  ],
  [
    "unclosed quote",
    (r) => utf8(`${longFile(r, r.int(0, 10))}\nNHA001,"Countermovement jump,1,4${"1\n".repeat(r.int(0, 50))}`),
  ],
  [
    "misplaced quotes",
    (r) => utf8(`athlete,test,trial,value\n${'"NHA001"x,"Countermovement jump" ,1,"4"1\n'.repeat(r.int(1, 200))}`),
  ],
  [
    "formula cells",
    (r) =>
      utf8(
        `athlete,test,trial,value\n${Array.from({ length: r.int(1, 30) }, () => [r.pick([...FORMULAS, "NHA001"]), r.pick([...FORMULAS, "10 m sprint"]), r.pick(["1", "=1", "+1"]), r.pick([...FORMULAS, "1.8"])].join(",")).join("\n")}`,
      ),
  ],
  [
    "extreme numbers",
    (r) =>
      utf8(
        `athlete,test,trial,value\n${Array.from({ length: r.int(1, 30) }, () => `${r.pick(ATHLETES.slice(0, 4))},${r.pick(TESTS.slice(0, 4))},${r.int(1, 3)},${r.pick(NUMBERS)}`).join("\n")}`,
      ),
  ],
  ["extreme numbers, wide", (r) => utf8(wideFile(r, r.int(1, 8), r.int(1, 20)))],
  ["10 000 columns", (r) => utf8(wideFile(r, 10_000, r.int(0, 2)))],
  [
    "duplicate headers",
    (r) =>
      utf8(
        `athlete,athlete,test,test,value,Value\n${Array.from({ length: r.int(1, 10) }, () => "NHA001,NHA002,10 m sprint,10 m sprint,1.8,1.9").join("\n")}`,
      ),
  ],
  [
    "NUL bytes",
    (r) => {
      const b = utf8(longFile(r, r.int(1, 10)));
      b[r.int(0, b.length - 1)] = 0;
      return b;
    },
  ],
  ["mutated long file", (r) => mutate(r, utf8(longFile(r, r.int(1, 40), r.pick(DELIMITERS))))],
  ["mutated wide file", (r) => mutate(r, utf8(wideFile(r, r.int(1, 12), r.int(1, 20))))],
];

/** A few multi-MB files of the worst shapes (the route takes up to 10 MB). */
function bigFiles(r: Random): HostileFile[] {
  const MB = 1024 * 1024;
  return [
    {
      kind: "big: 3 MB one line",
      bytes: utf8(Array.from({ length: (3 * MB) / 6 }, (_, i) => `h${i % 1000}`).join(",")),
    },
    {
      kind: "big: 4 MB of blank lines",
      bytes: utf8(`${"\n".repeat(4 * MB)}athlete,test,trial,value\nNHA001,Back squat 1RM,1,${r.pick(NUMBERS)}\n`),
    },
    { kind: "big: 3 MB random bytes", bytes: Uint8Array.from({ length: 3 * MB }, () => r.int(1, 255)) },
    {
      kind: "big: 5 MB quoted field",
      bytes: utf8(`athlete,test,trial,value\nNHA001,"${'x""'.repeat((5 * MB) / 3)}",1,2\n`),
    },
    { kind: "big: 4 MB of delimiters", bytes: utf8(`athlete,test,trial,value\n${",".repeat(4 * MB)}`) },
    {
      kind: "big: 2 MB of extreme numbers",
      bytes: utf8(
        `athlete,test,trial,value\n${`NHA002,Countermovement jump,1,1${"0".repeat(400)}\n`.repeat((2 * MB) / 440)}`,
      ),
    },
  ];
}

export function hostileFiles(seed: number, count: number): HostileFile[] {
  const r = seeded(seed);
  const files = bigFiles(r);
  while (files.length < count) {
    const [kind, make] = r.pick(KINDS);
    files.push({ kind, bytes: make(r) });
  }
  return files;
}
