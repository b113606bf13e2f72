/**
 * The exploration export's worker thread: plans and runs a saved
 * exploration's grid on the revision's stored input with the numeric path,
 * then writes the CSV or .xlsx file, and answers with the file's bytes (see
 * exploration-export.ts, which starts it with a time and memory limit and
 * terminates it afterwards).
 */
import { parentPort, workerData } from "node:worker_threads";
import { planAndRun } from "@/lib/explore/run";
import { numericModel } from "@/lib/formulation/numeric/model";
import type { ExportJob, ExportReply } from "./exploration-export";
import { explorationCsv, explorationWorkbook } from "./exploration-sheet";

function answer(job: ExportJob): ExportReply {
  const run = planAndRun({ base: job.base, grid: job.grid, outputs: job.outputs, search: job.search, model: numericModel(job.base.materials) });
  if ("message" in run) return { ok: false, field: run.field, message: run.message };
  const exported = { formulationName: job.formulationName, revisionLabel: job.revisionLabel, explorationName: job.explorationName, base: job.base, run, search: job.search };
  const bytes = job.format === "csv" ? new TextEncoder().encode(explorationCsv(exported)) : new Uint8Array(explorationWorkbook(exported));
  return { ok: true, bytes };
}

const reply = answer(workerData as ExportJob);
parentPort?.postMessage(reply, reply.ok ? [reply.bytes.buffer as ArrayBuffer] : []);
