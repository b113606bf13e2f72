/**
 * End to end, in Chromium, the editor's engine-v2 fields: titanium
 * isopropoxide chelated 1:1 with acetylacetone (a modifier line in the
 * recipe, the bonded ligand as a phase of the composite), water per mol TEOS
 * = 12 with carried water not counted, and a PEG drying step moved to the sol
 * stage (its melting caution goes; the thermal matrix shows stage and
 * atmosphere). Saving keeps every new field.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openSession, pickOption, poll, screenshot, setNumber, signInAs, unique, type Session } from "./browser";
import { demo } from "./http";

describe("engine v2 fields in the editor", () => {
  let session: Session;

  beforeAll(async () => {
    session = await openSession();
    await signInAs(session.page, demo.formulator);
  });

  afterAll(async () => {
    await session?.close();
  });

  it("chelates titanium isopropoxide with acetylacetone, sets water per mol TEOS, and keeps both on save", async () => {
    const page = session.page;
    await page.goto("/formulations/new");
    await page.getByLabel("Name", { exact: true }).fill(`E2E chelated titania ${unique()}`);
    await pickOption(page, "#f-components-0-materialId", /Titanium\(IV\) isopropoxide/);
    await setNumber(page, "#f-components-0-weightPercent", 20);
    await page.getByRole("button", { name: "Add component" }).click();
    await pickOption(page, "#f-components-1-materialId", /Tetraethoxysilane/);
    await poll(() => page.locator("#f-components-1-weightPercent").inputValue()).toBe("80");

    // Unmodified titanium alkoxide at R = 4: the engine cautions that it will precipitate.
    await poll(() => page.locator('[data-code="fast_hydrolysis_unmodified"]').count()).toBe(1);

    await page.getByRole("button", { name: "Add modifier" }).click();
    await pickOption(page, "#f-modifiers-0-materialId", /Acetylacetone/);
    await pickOption(page, "#f-modifiers-0-precursorId", /Titanium/);
    await setNumber(page, "#f-modifiers-0-molPerMetal", 1);
    const recipe = page.getByTestId("recipe-table");
    await poll(() => recipe.getByRole("row", { name: /Acetylacetone/ }).textContent()).toMatch(/Modifier/);
    await poll(() => page.locator('[data-code="fast_hydrolysis_unmodified"]').count()).toBe(0);
    await poll(() => page.getByTestId("composite-table").textContent()).toMatch(/Bonded ligand C5H7O[\d.]* from Acetylacetone/);
    await poll(() => page.getByTestId("modifiers-table").textContent()).toMatch(/Titanium/);

    // Too much ligand: four alkoxy groups per Ti, acac x = 5 replaces five; the message sits at the ratio.
    await setNumber(page, "#f-modifiers-0-molPerMetal", 5);
    await poll(() => page.locator("#f-modifiers-0-molPerMetal-error").textContent()).toMatch(/^Modifier 1, mol per mol metal: .*alkoxy groups per metal atom/);
    await setNumber(page, "#f-modifiers-0-molPerMetal", 1);
    await poll(() => page.locator("#f-modifiers-0-molPerMetal-error").textContent()).toBe("");

    const waterRow = recipe.getByRole("row", { name: /Deionised water/ });
    await poll(() => waterRow.textContent()).toMatch(/\d+\.\d+\s*g/);
    const atR4 = await waterRow.textContent();
    await page.locator("#f-water-ratio").selectOption("perPrecursor");
    await pickOption(page, "#f-water-referenceId", /Tetraethoxysilane/);
    await setNumber(page, "#f-water-value", 12);
    await page.locator("#f-water-countCarried").uncheck();
    await poll(() => waterRow.textContent()).not.toBe(atR4);
    await poll(() => page.locator("#water").textContent()).toMatch(/Target water at H₂O : Tetraethoxysilane \(TEOS\) = 12/);
    await poll(() => page.locator("#water").textContent()).toMatch(/not counted/);
    await screenshot(page, "editor-modifier-water-per-precursor");

    await page.getByRole("button", { name: "Create formulation" }).click();
    await page.waitForURL(/\/revisions\/[0-9a-f-]{36}\/edit/);
    // The saved draft opens with every new field as entered.
    await page.reload();
    await poll(() => page.locator("#f-modifiers-0-materialId").inputValue()).toMatch(/.+/);
    expect(await page.locator("#f-modifiers-0-molPerMetal").inputValue()).toBe("1");
    expect(await page.locator("#f-water-ratio").inputValue()).toBe("perPrecursor");
    expect(await page.locator("#f-water-value").inputValue()).toBe("12");
    expect(await page.locator("#f-water-countCarried").isChecked()).toBe(false);
    expect(await page.locator("#f-steps-0-stage").inputValue()).toBe("sol");
    await poll(() => recipe.getByRole("row", { name: /Acetylacetone/ }).count()).toBe(1);
  });

  it("drops the PEG melting caution when the 60 °C step is in the sol, and the matrix shows stage and atmosphere", async () => {
    const page = session.page;
    await page.goto("/formulations/new");
    await page.getByLabel("Name", { exact: true }).fill(`E2E PEG hybrid ${unique()}`);
    await pickOption(page, "#f-components-0-materialId", /Tetraethoxysilane/);
    await setNumber(page, "#f-components-0-weightPercent", 80);
    await page.getByRole("button", { name: "Add component" }).click();
    await pickOption(page, "#f-components-1-materialId", /Poly\(ethylene glycol\)/);
    // The template's second step dries at 60 °C; PEG melts at about 52 °C.
    expect(await page.locator("#f-steps-1-stage").inputValue()).toBe("drying");
    const matrix = page.getByTestId("thermal-matrix");
    const pegRow = matrix.getByRole("row", { name: /Poly\(ethylene glycol\)/ });
    await poll(() => pegRow.textContent()).toMatch(/Caution.*melting point/);
    await poll(() => page.getByTestId("step-conditions-1").textContent()).toBe("Drying · Air");

    await page.locator("#f-steps-1-stage").selectOption("sol");
    await page.locator("#f-steps-1-atmosphere").selectOption("inert");
    await poll(() => page.getByTestId("step-conditions-1").textContent()).toBe("Sol · Inert gas");
    await poll(() => pegRow.textContent()).not.toMatch(/Caution/);
    expect(await page.getByTestId("schedule-steps").textContent()).toMatch(/Sol · Inert gas/);
    await screenshot(page, "thermal-stage-atmosphere");
  });
});
