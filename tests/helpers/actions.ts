// Calling a server action over HTTP the way React's form submission does: the form's fields
// under the `_1_` prefix (argument 1 of the action is the FormData), then the argument list in part
// `0` — (previous state, a reference to that FormData) — sent last. With the fields under any other
// name the action receives an empty form.
export function actionRequest(actionId: string, fields: Record<string, string>, origin: string): RequestInit {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(`_1_${k}`, v);
  form.append('0', '[{},"$K1"]');
  return { method: 'POST', body: form, headers: { 'next-action': actionId, origin } };
}

/** The object that follows `"<key>":` in an action's answer (the RSC payload), parsed; null if absent. */
export function objectInAnswer(text: string, key: string): Record<string, unknown> | null {
  const start = text.indexOf(`"${key}":{`);
  if (start < 0) return null;
  const from = start + key.length + 3; // the opening brace
  let depth = 0;
  let inString = false;
  for (let i = from; i < text.length; i++) {
    const ch = text[i];
    if (inString) {
      if (ch === '\\') i++;
      else if (ch === '"') inString = false;
    } else if (ch === '"') inString = true;
    else if (ch === '{') depth++;
    else if (ch === '}' && --depth === 0) {
      try {
        return JSON.parse(text.slice(from, i + 1)) as Record<string, unknown>;
      } catch {
        return null;
      }
    }
  }
  return null;
}
