"use client";

import { ToneBadge } from "@/components/ui/tone-badge";
import { fmtMoney } from "@/lib/currency";
import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import { fmtQuantity, fmtRatio, fmtVolume, sig } from "@/lib/format";
import { COAT_METHOD_LABELS } from "@/lib/labels";
import { coatCurve } from "./coat-curve";
import { CoatPlot } from "./coat-plot";
import { FigureRows } from "./table";

interface CoatPanelProps {
  input: FormulationInput;
  result: FormulationResult;
  /** The team's currency code, shown with every cost. */
  currency: string;
}

/** Capillary number above which Landau–Levich is less reliable (chemistry.md, "What the coat will be"). */
const CA_LIMIT = 0.01;
/** |Δn| above which interference fringes show on a transparent substrate (common practice, from memory). */
const FRINGE_DELTA_N = 0.01;
/** Amine-hydrogen to epoxy ratio the cure should stay within (Lee & Neville, Handbook of Epoxy Resins, 1967). */
const CURE_RATIO = { min: 0.8, max: 1.2 } as const;

/** The Δn in words, signed: "+0.035". */
const signed = (x: number) => `${x > 0 ? "+" : x < 0 ? "−" : "±"}${Math.abs(x).toFixed(3)}`;

/** What the coat will be: film thickness and the speed for the target, index against the substrate, VOC, epoxy–amine balance, cost. */
export function CoatPanel({ input, result, currency }: CoatPanelProps) {
  const film = result.coating;
  const spec = input.coating;
  const curve = coatCurve(spec, film);
  const substrate = input.materials.find((m) => m.id === input.substrateId);
  return (
    <div className="flex flex-col gap-4" data-testid="coat-panel">
      <section aria-labelledby="coat-film-h">
        <h3 id="coat-film-h" className="mb-1 text-sm font-semibold">
          Film{spec ? `: ${COAT_METHOD_LABELS[spec.method].toLowerCase()}` : ""}
        </h3>
        {!spec ? (
          <p className="text-sm text-muted">Set how the coat is applied (the Coat section) to see its wet and dry thickness.</p>
        ) : !film ? (
          <p className="text-sm text-muted" data-testid="coat-film-missing">
            No film figures for this result (computed by an engine before the coat predictions).
          </p>
        ) : (
          <FigureRows
            caption="Film figures"
            rows={[
              { label: "Wet film thickness", value: <span data-testid="coat-wet">{fmtQuantity(film.wetThicknessUm, "µm", 3)}</span> },
              {
                label: "Dry film thickness",
                note: "wet × solid volume fraction / (1 − porosity)",
                value: <span data-testid="coat-dry">{fmtQuantity(film.dryThicknessNm, "nm", 3)}</span>,
              },
              { label: "Solid volume fraction of the sol", value: fmtQuantity(film.solidVolumeFraction * 100, "vol%", 3) },
              { label: "Coverage", note: "no losses", value: fmtQuantity(film.coverageM2PerL, "m²/L", 3) },
              ...(film.solMlForArea !== undefined && spec.areaM2 !== undefined
                ? [{ label: `Sol for ${sig(spec.areaM2, 3)} m²`, note: "no losses", value: <span data-testid="coat-sol-for-area">{fmtVolume(film.solMlForArea)}</span> }]
                : []),
              ...(film.withdrawalMmPerSForTarget !== undefined
                ? [
                    {
                      label: `Withdrawal speed for ${sig(spec.targetDryThicknessNm ?? Number.NaN, 4)} nm dry`,
                      value: <span data-testid="coat-speed-for-target">{fmtQuantity(film.withdrawalMmPerSForTarget, "mm/s", 3)}</span>,
                    },
                  ]
                : []),
              ...(film.rpmForTarget !== undefined
                ? [
                    {
                      label: `Spin speed for ${sig(spec.targetDryThicknessNm ?? Number.NaN, 4)} nm dry`,
                      value: <span data-testid="coat-rpm-for-target">{fmtQuantity(film.rpmForTarget, "rpm", 4)}</span>,
                    },
                  ]
                : []),
              ...(film.capillaryNumber !== undefined
                ? [
                    {
                      label: "Capillary number Ca = η U / γ",
                      note:
                        film.capillaryNumber <= CA_LIMIT ? (
                          <ToneBadge tone="clear" mark="✓">
                            within the thickness relation&rsquo;s range (Ca ≤ 0.01)
                          </ToneBadge>
                        ) : (
                          <ToneBadge tone="caution" mark="!">
                            above 0.01: the thickness is less reliable; slow down or thin the sol
                          </ToneBadge>
                        ),
                      value: <span data-testid="coat-ca">{sig(film.capillaryNumber, 2)}</span>,
                    },
                  ]
                : []),
            ]}
          />
        )}
        {curve ? <div className="mt-3">{<CoatPlot curve={curve} />}</div> : null}
      </section>

      <section aria-labelledby="coat-optics-h">
        <h3 id="coat-optics-h" className="mb-1 text-sm font-semibold">
          Refractive index
        </h3>
        {result.optics ? (
          <>
            <FigureRows
              caption="Refractive index of the dry coat and of the substrate"
              rows={[
                { label: "Dry coat, n_D", note: "Lorentz–Lorenz mixing, pores as air", value: <span data-testid="coat-index">{result.optics.refractiveIndex.toFixed(3)}</span> },
                {
                  label: substrate ? `Substrate: ${substrate.name}` : "Substrate",
                  value: result.optics.substrateIndex !== undefined ? result.optics.substrateIndex.toFixed(3) : "–",
                },
                ...(result.optics.mismatch !== undefined ? [{ label: "Difference, coat − substrate", value: signed(result.optics.mismatch) }] : []),
              ]}
            />
            <p className="mt-1 text-sm" data-testid="coat-fringes">
              {result.optics.mismatch === undefined ? (
                <span className="text-muted">
                  {substrate ? `${substrate.name} has no refractive index in the library: nothing to compare.` : "No substrate: nothing to compare."}
                </span>
              ) : Math.abs(result.optics.mismatch) <= FRINGE_DELTA_N ? (
                <ToneBadge tone="clear" mark="✓">
                  Matched within ±{FRINGE_DELTA_N}: no interference fringes expected
                </ToneBadge>
              ) : (
                <ToneBadge tone="caution" mark="!">
                  Differs by more than {FRINGE_DELTA_N}: interference fringes likely on a transparent part
                </ToneBadge>
              )}
            </p>
          </>
        ) : (
          <p className="text-sm text-muted">Not computed: a phase of the dry coat has no refractive index (see the notices).</p>
        )}
      </section>

      <section aria-labelledby="coat-voc-h">
        <h3 id="coat-voc-h" className="mb-1 text-sm font-semibold">
          Volatile organic compounds
        </h3>
        {result.voc ? (
          <FigureRows
            caption="VOC of the sol"
            rows={[
              { label: "VOC in the batch", note: "solvents, volatile catalysts and modifiers, and the alcohol hydrolysis releases", value: fmtQuantity(result.voc.massGrams, "g", 4) },
              { label: "VOC per litre of sol", value: <span data-testid="coat-voc">{fmtQuantity(result.voc.gramsPerLitre, "g/L", 3)}</span> },
              { label: "VOC per litre of sol less water", note: "the basis of ASTM D3960 and US EPA Method 24", value: <span data-testid="coat-voc-less-water">{fmtQuantity(result.voc.gramsPerLitreLessWater, "g/L", 3)}</span> },
              { label: "Water in the sol", value: fmtVolume(result.voc.waterMl) },
            ]}
          />
        ) : (
          <p className="text-sm text-muted">No VOC figures for this result (computed by an engine before the coat predictions).</p>
        )}
      </section>

      {result.cure ? (
        <section aria-labelledby="coat-cure-h">
          <h3 id="coat-cure-h" className="mb-1 text-sm font-semibold">
            Epoxy–amine balance
          </h3>
          <FigureRows
            caption="Epoxy and amine-hydrogen equivalents"
            rows={[
              { label: "Epoxy groups", value: fmtQuantity(result.cure.epoxyEq * 1000, "mmol", 4) },
              { label: "Amine hydrogens", value: fmtQuantity(result.cure.amineHydrogenEq * 1000, "mmol", 4) },
              {
                label: "Amine hydrogens per epoxy group",
                note:
                  result.cure.ratio === undefined ? (
                    "no epoxy groups"
                  ) : !(result.cure.amineHydrogenEq > 0) ? (
                    // Judged only when both groups are present (chemistry.md): a GPTMS hard coat without an amine cures its epoxy otherwise.
                    "no amine curing agent: nothing to balance"
                  ) : result.cure.ratio >= CURE_RATIO.min && result.cure.ratio <= CURE_RATIO.max ? (
                    <ToneBadge tone="clear" mark="✓">
                      balanced (0.8–1.2)
                    </ToneBadge>
                  ) : (
                    <ToneBadge tone="caution" mark="!">
                      {result.cure.ratio < CURE_RATIO.min ? "amine short: epoxy groups left unreacted" : "amine in excess"} (aim for 0.8–1.2)
                    </ToneBadge>
                  ),
                value: <span data-testid="coat-cure-ratio">{result.cure.ratio === undefined ? "–" : fmtRatio(result.cure.ratio, 3)}</span>,
              },
            ]}
          />
        </section>
      ) : null}

      <section aria-labelledby="coat-cost-h">
        <h3 id="coat-cost-h" className="mb-1 text-sm font-semibold">
          Cost <span className="font-normal text-muted">in {currency}, the team&rsquo;s currency</span>
        </h3>
        {result.cost ? (
          <FigureRows
            caption={`Cost in ${currency}`}
            rows={[
              { label: "Per batch", value: <span data-testid="coat-cost-total">{fmtMoney(result.cost.total, currency)}</span> },
              { label: "Per kg of dry composite", value: `${fmtMoney(result.cost.perKgDry, currency)}/kg` },
              { label: "Per litre of sol", value: `${fmtMoney(result.cost.perLitreSol, currency)}/L` },
              ...(result.cost.perM2 !== undefined ? [{ label: "Per m² coated", note: "at the predicted coverage, no losses", value: `${fmtMoney(result.cost.perM2, currency)}/m²` }] : []),
            ]}
          />
        ) : (
          <p className="text-sm text-muted">Not computed: a dispensed material has no price (see the notices; prices are kept in the materials library).</p>
        )}
      </section>
    </div>
  );
}
