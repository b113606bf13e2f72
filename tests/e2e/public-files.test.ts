/** The app's icon and web manifest (public/), which every page links to. */
import { describe, expect, it } from "vitest";
import { BASE } from "./http";

describe("icon and web manifest", () => {
  it("links every page to the icon and the manifest, and serves both", async () => {
    const html = await (await fetch(`${BASE}/sign-in`)).text();
    const links = html.match(/<link\b[^>]*>/g) ?? [];
    expect(links.find((l) => l.includes('rel="icon"'))).toContain('href="/icon.svg"');
    expect(links.find((l) => l.includes('rel="manifest"'))).toContain('href="/manifest.webmanifest"');
    const icon = await fetch(`${BASE}/icon.svg`);
    expect(icon.status).toBe(200);
    expect(icon.headers.get("content-type")).toMatch(/image\/svg\+xml/);
    expect(await icon.text()).toMatch(/^<svg [^>]*viewBox="0 0 64 64"/);
  });

  it("returns a manifest whose name, start page and icons are all there", async () => {
    // Field names from the W3C Web Application Manifest specification.
    const res = await fetch(`${BASE}/manifest.webmanifest`);
    expect(res.status).toBe(200);
    const manifest = (await res.json()) as { name: string; start_url: string; icons: { src: string }[] };
    expect(manifest.name).toBe("Gelwright");
    expect(manifest.icons.length).toBeGreaterThan(0);
    for (const icon of manifest.icons) expect((await fetch(new URL(icon.src, BASE))).status).toBe(200);
    expect((await fetch(new URL(manifest.start_url, BASE), { redirect: "manual" })).status).toBeLessThan(400);
  });
});
