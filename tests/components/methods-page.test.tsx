import { render } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import MethodsPage from "@/app/methods/page";
import { OUTPUT_FIELDS, outputFieldCitations } from "@/engine/output-fields";
import { CITATIONS } from "@/engine/methods/citations";

// The whole page rendered in jsdom: seconds on a loaded machine, so room to finish (not a speed check).
describe("the methods page", { timeout: 30_000 }, () => {
  it("every output field's methods entry and every citation key of it is an anchor on the page, with the field listed in its entry", () => {
    const { container } = render(<MethodsPage />);
    const byId = new Map([...container.querySelectorAll("[id]")].map((e) => [e.id, e]));
    const texts = new Map<string, string>();
    const links = new Map<string, Set<string>>();
    for (const f of OUTPUT_FIELDS) {
      const entry = byId.get(f.method);
      expect(entry, `${f.path} → #${f.method}`).toBeDefined();
      if (!texts.has(f.method)) {
        texts.set(f.method, entry!.textContent ?? "");
        links.set(f.method, new Set([...entry!.querySelectorAll("a")].map((a) => a.getAttribute("href") ?? "")));
      }
      expect(texts.get(f.method), `${f.path} listed in #${f.method}`).toContain(f.path);
      for (const k of outputFieldCitations(f)) {
        expect(byId.has(k), `${f.path} → #${k}`).toBe(true);
        // The entry links its sources on the page.
        expect(links.get(f.method)!.has(`#${k}`), `${f.method} links #${k}`).toBe(true);
      }
    }
  });

  it("every source carries its full citation and says how the product knows it, in words", () => {
    const { container } = render(<MethodsPage />);
    for (const c of CITATIONS) {
      const li = container.querySelector(`[id="${c.key}"]`)!;
      expect(li.textContent).toContain(c.text);
      expect(li.textContent).toMatch(/Read at the address given|as remembered|Worked out for this product|Common practice: no published source/);
    }
    expect(container.textContent).not.toMatch(/\bREFERENCES\b|\[(F|M|D|C)\]/);
  });
});
