import { describe, expect, it } from "vitest";
import { setUpBrowser } from "./helpers/browser";

const browser = setUpBrowser();

describe("home page", () => {
  it("answers with the Knucklebench heading", async () => {
    const page = await browser.newPage();
    const response = await page.goto("/");
    expect(response?.status()).toBeLessThan(400);
    await page.getByRole("heading", { name: "Knucklebench" }).first().waitFor({ state: "visible" });
  });
});
