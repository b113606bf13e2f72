"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, useWatch, type FieldErrors, type Resolver } from "react-hook-form";
import { KIND_LABELS } from "@/components/results/words";
import { Button } from "@/components/ui/button";
import { useConfirm } from "@/components/ui/confirm-dialog";
import { Field, inputClass } from "@/components/ui/field";
import { HazardCodes, SafetyNote } from "@/components/ui/hazards";
import { OutcomeMessage, type Outcome } from "@/components/ui/outcome";
import { MATERIAL_KINDS, materialSchema, type Material, type MaterialKind } from "@/lib/formulation";
import { ApiRequestError, errorMessage } from "@/lib/client/fetcher";
import { useInvalidate } from "@/lib/client/invalidate";
import { createMaterial, deleteMaterial, updateMaterial, useLibrary, type LibraryMaterial } from "@/lib/client/materials";
import { useTeamCurrency } from "@/lib/client/team-settings";
import { ALL_FIELDS, formKey, PROPERTY_GROUPS } from "./material-fields";

type FormValues = Record<string, string>;

function get(obj: unknown, path: string): unknown {
  return path.split(".").reduce<unknown>((o, k) => (o && typeof o === "object" ? (o as Record<string, unknown>)[k] : undefined), obj);
}

function set(obj: Record<string, unknown>, path: string, value: unknown): void {
  const keys = path.split(".");
  let o = obj;
  keys.slice(0, -1).forEach((k) => {
    o[k] ??= {};
    o = o[k] as Record<string, unknown>;
  });
  o[keys[keys.length - 1]!] = value;
}

/** Form values (all text) from a material record. */
function toForm(m: Partial<LibraryMaterial>): FormValues {
  const v: FormValues = {
    name: m.name ?? "",
    kind: m.kind ?? "precursor",
    casNumber: m.casNumber ?? "",
    hazards: (m.hazards ?? []).join(", "),
  };
  for (const f of ALL_FIELDS) {
    const value = get(m, f.path);
    v[formKey(f.path)] = value === undefined || value === null ? "" : typeof value === "boolean" ? (value ? "yes" : "no") : String(value);
    v[`src__${formKey(f.path)}`] = m.sources?.[f.path] ?? "";
  }
  v.src__hazards = m.sources?.hazards ?? "";
  return v;
}

/** The Material record the form describes (numbers parsed; blank fields left out). */
function toMaterial(v: FormValues, id: string): Material {
  const kind = v.kind as MaterialKind;
  const m: Record<string, unknown> = { id, name: v.name?.trim() ?? "", kind };
  const sources: Record<string, string> = {};
  for (const group of PROPERTY_GROUPS) {
    if (group.kinds && !group.kinds.includes(kind)) continue;
    for (const f of group.fields) {
      if (f.kinds && !f.kinds.includes(kind)) continue;
      const raw = (v[formKey(f.path)] ?? "").trim();
      if (f.path === "solventId" && !(v.solventFraction ?? "").trim()) continue;
      if (raw !== "") set(m, f.path, f.type === "number" ? Number(raw.replace(",", ".")) : f.type === "flag" ? raw === "yes" : raw);
      const src = (v[`src__${formKey(f.path)}`] ?? "").trim();
      if (src) sources[f.path] = src;
    }
  }
  const hazards = (v.hazards ?? "")
    .split(/[\s,;]+/)
    .map((h) => h.trim().toUpperCase())
    .filter(Boolean);
  if (hazards.length) m.hazards = hazards;
  if ((v.src__hazards ?? "").trim()) sources.hazards = v.src__hazards!.trim();
  if (Object.keys(sources).length) m.sources = sources;
  return m as unknown as Material;
}

/** Field of the form for a Material path ("precursor.residueDensity", "hazards.0"). */
function fieldOf(path: string): string {
  if (path.startsWith("hazards")) return "hazards";
  if (path === "name" || path === "kind") return path;
  const exact = ALL_FIELDS.find((f) => path === f.path || path.startsWith(`${f.path}.`));
  if (exact) return formKey(exact.path);
  const parent = ALL_FIELDS.find((f) => f.path.startsWith(`${path}.`));
  return parent ? formKey(parent.path) : "name";
}

/** react-hook-form resolver: the shared materialSchema, applied to the record the form describes. */
const resolver: Resolver<FormValues> = async (values) => {
  const parsed = materialSchema.safeParse(toMaterial(values, "draft"));
  const cas = (values.casNumber ?? "").trim();
  const errors: FieldErrors<FormValues> = {};
  if (cas && !/^\d{2,7}-\d{2}-\d$/.test(cas)) errors.casNumber = { type: "pattern", message: "A CAS number looks like 78-10-4" };
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = fieldOf(issue.path.map(String).join("."));
      errors[key] ??= { type: "schema", message: issue.message };
    }
  }
  return Object.keys(errors).length ? { values: {}, errors } : { values, errors: {} };
};

interface MaterialFormProps {
  material?: LibraryMaterial;
  canSave: boolean;
  canDelete: boolean;
}

/** Every property of a material with its unit and its source, validated by the shared schema. */
export function MaterialForm({ material, canSave, canDelete }: MaterialFormProps) {
  const router = useRouter();
  const invalidate = useInvalidate();
  const [message, setMessage] = useState<Outcome>(null);
  const [confirmDialog, ask] = useConfirm();
  const form = useForm<FormValues>({ resolver, defaultValues: toForm(material ?? {}), mode: "onTouched" });
  const { register, handleSubmit, formState, control, setError } = form;
  const kind = useWatch({ control, name: "kind" }) as MaterialKind;
  const hazardsText = useWatch({ control, name: "hazards" }) ?? "";
  const nameText = useWatch({ control, name: "name" }) ?? "";
  const solventFraction = useWatch({ control, name: "solventFraction" }) ?? "";
  const library = useLibrary();
  const currency = useTeamCurrency();
  const solvents = (library.data?.rows ?? []).filter((m) => m.kind === "solvent" && m.id !== material?.id);
  const errors = formState.errors;

  const onSubmit = handleSubmit(
    async (values) => {
      setMessage(null);
      const body = { material: toMaterial(values, material?.id ?? "new"), casNumber: values.casNumber?.trim() || null };
      try {
        const saved = material ? await updateMaterial(material.id, body) : await createMaterial(body);
        await invalidate("materials");
        if (!material) router.push(`/materials/${saved.id}`);
        else {
          form.reset(toForm(saved));
          setMessage({ tone: "info", text: "Saved. Formulations keep the copy they were made with; new edits pick up this version." });
        }
        router.refresh();
      } catch (err) {
        if (err instanceof ApiRequestError && Object.keys(err.fields).length) {
          for (const [path, msg] of Object.entries(err.fields)) setError(fieldOf(path.replace(/^material\./, "")), { message: msg });
        }
        setMessage({ tone: "error", text: `Not saved: ${errorMessage(err)}` });
      }
    },
    () => setMessage({ tone: "error", text: "Not saved: correct the fields marked in red." }),
  );

  async function remove() {
    if (!material) return;
    const confirmed = await ask({
      title: `Remove ${material.name}?`,
      message: "It leaves the team's library. Formulations that use it keep their own copy of its data.",
      confirmLabel: "Remove from the library",
    });
    if (!confirmed) return;
    try {
      await deleteMaterial(material.id);
      await invalidate("materials");
      router.push("/materials");
      router.refresh();
    } catch (err) {
      setMessage({ tone: "error", text: `Not removed: ${errorMessage(err)}` });
    }
  }

  const text = (name: string, extra = "") => ({
    id: `m-${name}`,
    readOnly: !canSave,
    className: inputClass(!!errors[name], extra),
    "aria-invalid": errors[name] ? true : undefined,
    "aria-describedby": `m-${name}-error`,
    ...register(name),
  });

  const hazardList = hazardsText.split(/[\s,;]+/).filter(Boolean).map((h) => h.toUpperCase());
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Material">
      {confirmDialog}
      <SafetyNote items={[{ name: nameText || "This material", hazards: hazardList }]} />
      <fieldset className="grid gap-3 rounded border border-rule bg-panel p-3 sm:grid-cols-3">
        <legend className="px-1 text-sm font-semibold">Identity</legend>
        <Field id="m-name" label="Name" error={errors.name?.message}>
          <input {...text("name")} />
        </Field>
        <Field id="m-kind" label="Kind" error={errors.kind?.message}>
          <select {...text("kind")} disabled={!canSave}>
            {MATERIAL_KINDS.map((k) => (
              <option key={k} value={k}>
                {KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </Field>
        <Field id="m-casNumber" label="CAS number" hint="optional" error={errors.casNumber?.message}>
          <input {...text("casNumber", "num")} />
        </Field>
      </fieldset>
      {PROPERTY_GROUPS.filter((g) => (!g.kinds || g.kinds.includes(kind)) && g.fields.some((f) => !f.kinds || f.kinds.includes(kind))).map((g) => (
        <fieldset key={g.title} className="flex flex-col gap-2 rounded border border-rule bg-panel p-3">
          <legend className="px-1 text-sm font-semibold">{g.title}</legend>
          {g.fields
            .filter((f) => (!f.kinds || f.kinds.includes(kind)) && (f.type !== "solvent" || solventFraction.trim() !== ""))
            .map((f) => {
              const key = formKey(f.path);
              const input =
                f.type === "flag" ? (
                  <select {...text(key)} disabled={!canSave}>
                    <option value="">not set</option>
                    <option value="yes">yes</option>
                    <option value="no">no</option>
                  </select>
                ) : f.type === "solvent" ? (
                  <select {...text(key)} disabled={!canSave}>
                    <option value="">not named</option>
                    {solvents.map((o) => (
                      <option key={o.id} value={o.id}>
                        {o.name}
                      </option>
                    ))}
                  </select>
                ) : (
                  <input {...text(key, f.type === "number" ? "num" : "")} inputMode={f.type === "number" ? "decimal" : undefined} />
                );
              return (
                <div key={f.path} className="grid gap-2 border-b border-rule/60 pb-2 last:border-0 sm:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
                  <Field id={`m-${key}`} label={f.label} hint={f.unit ? `(${f.money ? `${currency} ` : ""}${f.unit})` : undefined} error={errors[key]?.message}>
                    {input}
                  </Field>
                  <Field id={`m-src__${key}`} label={<span className="font-normal text-muted">Source of this value</span>}>
                    <input {...text(`src__${key}`, "text-xs")} placeholder="e.g. supplier data sheet, handbook, measured" />
                  </Field>
                </div>
              );
            })}
        </fieldset>
      ))}
      <fieldset className="grid gap-2 rounded border border-rule bg-panel p-3 sm:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <legend className="px-1 text-sm font-semibold">Safety</legend>
        <Field id="m-hazards" label="GHS hazard statements" hint="codes, e.g. H225, H319" error={errors.hazards?.message}>
          <input {...text("hazards", "num font-mono")} />
        </Field>
        <Field id="m-src__hazards" label={<span className="font-normal text-muted">Source of the hazard statements</span>}>
          <input {...text("src__hazards", "text-xs")} placeholder="supplier's safety data sheet" />
        </Field>
        <div className="sm:col-span-2">
          <HazardCodes codes={hazardList} />
        </div>
      </fieldset>
      <OutcomeMessage outcome={message} />
      {canSave ? (
        <div className="flex flex-wrap gap-2">
          <Button type="submit" variant="primary" busy={formState.isSubmitting}>
            {material ? "Save material" : "Add to the library"}
          </Button>
          {material && canDelete ? (
            <Button variant="danger" onClick={remove}>
              Remove from the library
            </Button>
          ) : null}
        </div>
      ) : (
        <p className="text-sm text-muted">Your role can read the library but not change it.</p>
      )}
    </form>
  );
}
