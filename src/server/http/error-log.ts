// What a server error line may say about an error: its name, code and message with the values taken out.

/** Drizzle's "Failed query: … params: …" keeps its parameterised SQL, drops the values; quoted text goes. */
function safeMessage(message: string): string {
  const [head = ""] = message.split(/\nparams:/);
  if (head.startsWith("Failed query:")) return head.slice(0, 400);
  // PostgreSQL and JSON.parse quote the offending value ('invalid input syntax for type uuid: "…"').
  return head.replace(/"(?:[^"\\]|\\.)*"/g, '"…"').replace(/'(?:[^'\\]|\\.)*'/g, "'…'").slice(0, 400);
}

/**
 * One line per error in the cause chain (name, SQLSTATE or system code, message without values), then the
 * first stack frames of the outermost error: enough to find the bug, nothing the user typed.
 */
export function describeError(error: unknown): string {
  const parts: string[] = [];
  let current: unknown = error;
  for (let depth = 0; depth < 4 && current !== undefined && current !== null; depth++) {
    if (current instanceof Error) {
      const code = (current as { code?: unknown }).code;
      parts.push(`${current.name}${typeof code === "string" ? ` [${code}]` : ""}: ${safeMessage(current.message)}`);
      current = (current as { cause?: unknown }).cause;
    } else {
      parts.push(`thrown ${typeof current}`);
      break;
    }
  }
  const frames = error instanceof Error && error.stack ? error.stack.split("\n").filter((l) => l.startsWith("    at ")).slice(0, 8) : [];
  return [parts.join(" ← caused by "), ...frames].join("\n");
}
