import { preferencesBody } from "@/contracts/preferences";
import { getPreferences, setPreferences } from "@/server/data/preferences";
import { readJson } from "@/server/http/body";
import { sessionRoute } from "@/server/http/route";

export const GET = sessionRoute<object>(async (_req, signed) => Response.json({ preferences: await getPreferences(signed.user.id) }));

export const PUT = sessionRoute<object>(async (req, signed) => {
  const prefs = await readJson(req, preferencesBody);
  return Response.json({ preferences: await setPreferences(signed.user.id, prefs) });
});
