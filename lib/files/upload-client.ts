// Browser side of POST /api/files: sends the file as the raw body (streamed by the browser) and
// returns the stored file, or throws with the server's message.
export type UploadedFile = { id: string; name: string; kind: string; sizeBytes: number; sha256: string; url: string };

export async function uploadFile(file: File, purpose: string, params: Record<string, string> = {}): Promise<UploadedFile> {
  const query = new URLSearchParams({ purpose, ...params });
  let res: Response;
  try {
    res = await fetch(`/api/files?${query}`, {
      method: 'POST',
      body: file,
      headers: { 'x-file-name': encodeURIComponent(file.name), 'content-type': file.type || 'application/octet-stream' },
      credentials: 'same-origin',
    });
  } catch {
    throw new Error('The upload did not reach the server. Check the connection and try again.');
  }
  const body = (await res.json().catch(() => null)) as { file?: UploadedFile; error?: { message?: string } } | null;
  if (!res.ok || !body?.file) throw new Error(body?.error?.message ?? `The upload failed (${res.status}).`);
  return body.file;
}
