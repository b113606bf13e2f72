import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { pageContext } from "@/components/layout/page-context";
import { ControlChartView } from "@/components/quality/control-chart-view";
import { NotAllowed, PageHeader, Panel } from "@/components/ui/panel";
import { formulationCharts } from "@/db/queries/charts";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Control charts" };

/**
 * Control charts of a formulation: an I-MR chart per numeric specification
 * (limits from the batch results, specification limits drawn apart, run rules
 * flagged, Cpk from 25 results) and the weighing deviation per material line.
 * Method: NIST/SEMATECH e-Handbook of Statistical Methods, section 6.3.2; ISO 7870-2.
 */
export default async function ChartsPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await pageContext();
  if (!can(ctx.role, "batch:read")) return <NotAllowed what="see batch records and their charts" />;
  const { id } = await params;
  const data = await formulationCharts(ctx.teamId, id, { releasedOnly: !can(ctx.role, "formulation:readUnreleased") });
  if (!data) notFound();
  const specs = data.specifications.filter((s) => s.chart);
  const weighing = data.weighing.filter((w) => w.chart);
  return (
    <>
      <PageHeader
        title={`Control charts of ${data.formulationName}`}
        subtitle={
          <Link href={`/formulations/${data.formulationId}`} className="text-accent underline">
            Back to the formulation
          </Link>
        }
      />
      <p className="mb-4 max-w-3xl text-sm text-muted">
        Individuals and moving-range charts of the batches in time order. The centre line and control limits come from the results
        themselves (x̄ ± 3σ, σ estimated as the mean moving range / 1.128); the specification limits are drawn apart. Flagged: a point
        beyond 3σ, 2 of 3 consecutive points beyond 2σ on one side, 8 points in a row on one side of the centre line.
      </p>
      <Panel title="Test results per specification" id="specifications" className="mb-4">
        <div className="grid gap-6 p-3 xl:grid-cols-2">
          {specs.length === 0 ? (
            <p className="text-sm">No numeric results yet: a chart needs at least two batches with results against a numeric specification.</p>
          ) : (
            specs.map((s) => (
              <ControlChartView
                key={s.key}
                testId={`spec-chart-${s.key}`}
                title={s.property}
                unit={s.unit}
                dates={s.samples.map((x) => x.at)}
                chart={s.chart!}
                lower={s.lower}
                upper={s.upper}
                target={s.target}
                capability={s.capability}
                outOfSpec={s.samples.map((x) => x.outOfSpec)}
              />
            ))
          )}
        </div>
      </Panel>
      <Panel title="Weighing deviation per material line, (actual − target)/target" id="weighing">
        <div className="grid gap-6 p-3 xl:grid-cols-2">
          {weighing.length === 0 ? (
            <p className="text-sm">No weighed lines yet.</p>
          ) : (
            weighing.map((w) => (
              <ControlChartView key={w.materialId} testId={`weighing-chart-${w.materialId}`} title={`${w.name}: weighing deviation`} unit="%" dates={w.samples.map((x) => x.at)} chart={w.chart!} />
            ))
          )}
        </div>
      </Panel>
    </>
  );
}
