import { Panel } from "@/components/ui/panel";

interface FirstStepsProps {
  /** A new formulation also needs a name. */
  isNew: boolean;
}

/** What to fill in first, shown while a draft has no component yet (in place of results). */
export function FirstSteps({ isNew }: FirstStepsProps) {
  return (
    <Panel title="First steps">
      <ol className="list-decimal space-y-1 pl-5 text-sm" data-testid="first-steps">
        {isNew ? <li>Name the formulation; a project and a description are optional.</li> : null}
        <li>
          Choose the components of the dry composite: the precursors (they count by their residue, such as SiO₂) and the organic phases,
          each with its weight fraction. The fractions add up to 100 %.
        </li>
        <li>Set the basis: a dry solid mass, a sol mass with its solids content, or a gel body&apos;s mould volume and bulk density.</li>
        <li>Check the water ratio (R or h), the solvent and the catalyst; the library&apos;s usual ones are already chosen.</li>
        <li>List the process steps with their temperature and duration.</li>
      </ol>
      <p className="mt-2 text-xs text-muted">The recipe appears here as soon as the first component has a material.</p>
    </Panel>
  );
}
