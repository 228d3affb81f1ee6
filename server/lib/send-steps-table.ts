import { Readable, type Transform } from "node:stream";
import { pipeline } from "node:stream/promises";
import { createGunzip } from "node:zlib";
import type { Request, Response } from "express";
import { stepsCsvToJson } from "./steps-table.js";

/** A full step table to send: where its CSV comes from and what the JSON form needs. */
export interface StepsTableSource {
  /** A fresh stream of the CSV: gzip-compressed bytes when `gzipped`, else text. */
  readonly open: () => Readable;
  readonly gzipped: boolean;
  readonly branchIds: readonly string[];
  readonly engine: string;
  /** The download's file name without extension. */
  readonly fileStem: string;
}

/** Bytes in pieces of 64 kB, so a table held in memory is written with back-pressure like any stream. */
export function bufferStream(bytes: Uint8Array, pieceBytes = 64 * 1024): Readable {
  return Readable.from(
    (function* () {
      for (let at = 0; at < bytes.byteLength; at += pieceBytes) yield Buffer.from(bytes.buffer, bytes.byteOffset + at, Math.min(pieceBytes, bytes.byteLength - at));
    })(),
  );
}

/**
 * Streams a full step table as a download, CSV or JSON (`server/lib/steps-table.ts`), piece by piece: nothing
 * large is built in memory and no single step holds the event loop. A stored gzip CSV goes out as it is
 * (`Content-Encoding: gzip`) to a client that accepts gzip; JSON is made from the CSV on the way and compressed
 * by the compression middleware. A client that goes away ends the stream quietly.
 */
export async function sendStepsTable(req: Request, res: Response, source: StepsTableSource, format: "csv" | "json"): Promise<void> {
  res.setHeader("Cache-Control", "no-store");
  res.attachment(`${source.fileStem}.${format}`);
  const stages: Transform[] = [];
  if (format === "csv") {
    res.type("text/csv; charset=utf-8");
    res.vary("Accept-Encoding");
    if (source.gzipped && req.acceptsEncodings("gzip") === "gzip") res.setHeader("Content-Encoding", "gzip");
    else if (source.gzipped) stages.push(createGunzip());
  } else {
    res.type("application/json; charset=utf-8");
    if (source.gzipped) stages.push(createGunzip());
    stages.push(stepsCsvToJson(source.branchIds, source.engine));
  }
  try {
    await pipeline([source.open(), ...stages, res]);
  } catch (err) {
    // The client closed the connection: nothing to answer, and nothing went wrong on our side.
    if (res.destroyed && (err as NodeJS.ErrnoException).code === "ERR_STREAM_PREMATURE_CLOSE") return;
    throw err;
  }
}
