import { describe, expect, it } from "vitest";
import * as preferencesRoute from "@/app/api/me/preferences/route";
import { call, signUp } from "../helpers/api";

const path = "/api/me/preferences";

describe("a person's length unit is kept on the server", () => {
  it("answers 401 without a session", async () => {
    const res = await call<object>(preferencesRoute.GET, "GET", path, {});
    expect(res.status).toBe(401);
    const put = await call<object>(preferencesRoute.PUT, "PUT", path, {}, { body: { lengthUnit: "in" } });
    expect(put.status).toBe(401);
  });

  it("starts at mm, keeps inches once chosen, and is private to each person", async () => {
    const ilse = await signUp("Ilse Varga");
    const tomas = await signUp("Tomas Rehn");
    expect((await call<object>(preferencesRoute.GET, "GET", path, {}, { cookie: ilse.cookie })).json.preferences).toEqual({ lengthUnit: "mm" });
    const put = await call<object>(preferencesRoute.PUT, "PUT", path, {}, { cookie: ilse.cookie, body: { lengthUnit: "in" } });
    expect(put.status).toBe(200);
    expect(put.json.preferences).toEqual({ lengthUnit: "in" });
    expect((await call<object>(preferencesRoute.GET, "GET", path, {}, { cookie: ilse.cookie })).json.preferences.lengthUnit).toBe("in");
    expect((await call<object>(preferencesRoute.GET, "GET", path, {}, { cookie: tomas.cookie })).json.preferences.lengthUnit).toBe("mm");
    // Changing it again replaces the row rather than adding one.
    await call<object>(preferencesRoute.PUT, "PUT", path, {}, { cookie: ilse.cookie, body: { lengthUnit: "mm" } });
    expect((await call<object>(preferencesRoute.GET, "GET", path, {}, { cookie: ilse.cookie })).json.preferences.lengthUnit).toBe("mm");
  });

  it("refuses an unknown unit or an extra field with 422 naming the field", async () => {
    const who = await signUp("Pell Ostrander");
    const bad = await call<object>(preferencesRoute.PUT, "PUT", path, {}, { cookie: who.cookie, body: { lengthUnit: "furlong" } });
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields[0].path).toBe("lengthUnit");
    const extra = await call<object>(preferencesRoute.PUT, "PUT", path, {}, { cookie: who.cookie, body: { lengthUnit: "mm", theme: "dark" } });
    expect(extra.status).toBe(422);
  });
});
