/** A formulation released through the API with test specifications, for the quality tests (issue 17). */
import { expect } from "vitest";
import type { Specification } from "@/lib/quality/specification";
import { APPEARANCE_SPEC, VISCOSITY_SPEC } from "../helpers/specifications";
import { coatInput, type LibraryMaterial } from "./fixtures";
import type { Client } from "./http";

export { APPEARANCE_SPEC, VISCOSITY_SPEC };

/** Creates a formulation, sets its draft's specifications, submits, approves and releases it; returns the released revision. */
export async function releasedWithSpecs(
  formulator: Client,
  reviewer: Client,
  lib: Map<string, LibraryMaterial>,
  name: string,
  specs: Specification[] = [VISCOSITY_SPEC, APPEARANCE_SPEC],
): Promise<{ formulationId: string; revisionId: string }> {
  const created = await formulator.fetch("/api/formulations", { method: "POST", json: { name, project: "Quality", input: coatInput(lib) } });
  expect(created.status).toBe(201);
  const { formulationId, revisionId } = (await created.json()) as { formulationId: string; revisionId: string };
  const put = await formulator.fetch(`/api/revisions/${revisionId}/specifications`, { method: "PUT", json: { specifications: specs, version: 1 } });
  expect(put.status).toBe(200);
  expect((await formulator.fetch(`/api/revisions/${revisionId}/submit`, { method: "POST", json: {} })).status).toBe(200);
  // A comment, so a thermal caution is accepted too.
  expect((await reviewer.fetch(`/api/revisions/${revisionId}/approve`, { method: "POST", json: { comment: "Approved with its tests and limits." } })).status).toBe(200);
  expect((await reviewer.fetch(`/api/revisions/${revisionId}/release`, { method: "POST", json: {} })).status).toBe(200);
  return { formulationId, revisionId };
}
