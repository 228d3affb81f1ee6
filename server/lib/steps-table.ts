import { Transform, type TransformCallback } from "node:stream";
import type { SweepResult } from "../../shared/schemas/result.js";

/**
 * The full step table of a sweep — every solved step of every branch — as CSV (RFC 4180: comma, dot decimals,
 * CRLF, SI units in the header), branch by branch in speed order. Numbers are written exactly (shortest
 * round-trip form), so the JSON made from the CSV by `stepsCsvToJson` holds the engine's own values.
 */
function stepsCsvHeader(branchIds: readonly string[]): string {
  return [
    "branch",
    "speed_m_s",
    "frequency_hz",
    "damping_ratio",
    "re_rad_s",
    "im_rad_s",
    ...branchIds.map((id) => csvQuote(`participation_${id}`)),
    "mac",
    "confidence",
  ].join(",");
}

/**
 * The CSV in pieces of `rowsPerChunk` rows (the header first): a caller can stream it without building one large
 * string, or join the pieces where that is cheap (a worker thread).
 */
export function* stepsCsvChunks(result: Pick<SweepResult, "modes">, rowsPerChunk = 1000): Generator<string> {
  const ids = result.modes.map((m) => m.id);
  yield `${stepsCsvHeader(ids)}\r\n`;
  let lines: string[] = [];
  for (const mode of result.modes) {
    const branch = csvQuote(mode.id);
    for (const s of mode.steps) {
      lines.push(
        [branch, s.speed, s.frequency, s.damping, s.re, s.im, ...ids.map((id) => s.participation[id] ?? 0), s.mac, s.confidence].join(","),
      );
      if (lines.length >= rowsPerChunk) {
        yield `${lines.join("\r\n")}\r\n`;
        lines = [];
      }
    }
  }
  if (lines.length > 0) yield `${lines.join("\r\n")}\r\n`;
}

/** A CSV field, quoted when it holds a comma or a quote; line breaks inside become spaces (one row per line). */
function csvQuote(text: string): string {
  const flat = text.replace(/[\r\n]/g, " ");
  return /[",]/.test(flat) ? `"${flat.replace(/"/g, '""')}"` : flat;
}

/**
 * A stream that turns the CSV of `stepsCsvChunks` into the step table as JSON —
 * `{"engine": …, "modes": [{"id": …, "steps": [{speed, frequency, damping, re, im, participation, mac, confidence}]}]}`,
 * the shape of a result's `modes` with every solved step. Works chunk by chunk, so a large table never holds the
 * event loop; a number that is not finite becomes null. Branches are told apart by a change of the first column
 * and named from `branchIds` in order (so an id is exact even where the CSV had to flatten a line break).
 * @param branchIds the branch ids in column order (as in the header)
 * @param engine the engine version that produced the table
 */
export function stepsCsvToJson(branchIds: readonly string[], engine: string): Transform {
  let rest = "";
  let headerSeen = false;
  let current: string | null = null;
  let branchIndex = -1;
  let firstStep = true;
  const keys = branchIds.map((id) => JSON.stringify(id));
  const num = (text: string) => {
    const value = Number(text);
    return Number.isFinite(value) ? String(value) : "null";
  };
  const row = (line: string): string => {
    const [branch, cells] = splitBranch(line);
    let out = "";
    if (branch !== current) {
      branchIndex++;
      out += `${current === null ? "" : "]},"}{"id":${JSON.stringify(branchIds[branchIndex] ?? branch)},"steps":[`;
      current = branch;
      firstStep = true;
    }
    const share = keys.map((key, i) => `${key}:${num(cells[5 + i])}`).join(",");
    const m = 5 + keys.length;
    out +=
      `${firstStep ? "" : ","}{"speed":${num(cells[0])},"frequency":${num(cells[1])},"damping":${num(cells[2])},` +
      `"re":${num(cells[3])},"im":${num(cells[4])},"participation":{${share}},"mac":${num(cells[m])},"confidence":${num(cells[m + 1])}}`;
    firstStep = false;
    return out;
  };
  return new Transform({
    construct(callback) {
      this.push(`{"engine":${JSON.stringify(engine)},"modes":[`);
      callback();
    },
    transform(chunk: Buffer | string, _encoding, callback: TransformCallback) {
      const lines = (rest + chunk.toString()).split("\r\n");
      rest = lines.pop() ?? "";
      let out = "";
      for (const line of lines) {
        if (!headerSeen) headerSeen = true;
        else if (line !== "") out += row(line);
      }
      callback(null, out);
    },
    flush(callback: TransformCallback) {
      let out = rest !== "" && headerSeen ? row(rest) : "";
      out += `${current === null ? "" : "]}"}]}\n`;
      callback(null, out);
    },
  });
}

/** The first field of a CSV line (quoted or not) and the remaining cells, which are numbers. */
function splitBranch(line: string): [string, string[]] {
  if (!line.startsWith('"')) {
    const comma = line.indexOf(",");
    return [line.slice(0, comma), line.slice(comma + 1).split(",")];
  }
  let i = 1;
  let value = "";
  while (i < line.length) {
    const c = line[i];
    if (c === '"' && line[i + 1] === '"') {
      value += '"';
      i += 2;
    } else if (c === '"') {
      break;
    } else {
      value += c;
      i++;
    }
  }
  return [value, line.slice(i + 2).split(",")];
}
