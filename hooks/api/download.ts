/**
 * Downloads a file the API sends (a CSV export, an import's original) in a web browser. The file
 * is fetched with the session's bearer token, which a plain link could not send, then handed to
 * the browser as a blob under the given name.
 */
import { config } from '@/constants/config';
import { ApiError } from './client';

/** The server's error body of a refused download, as an ApiError. */
async function errorFromDownload(response: Response): Promise<ApiError> {
  const body = (await response.json().catch(() => null)) as {
    error?: { code?: string; message?: string; field?: string };
  } | null;
  const error = body?.error;
  return new ApiError(
    response.status,
    error?.code ?? `http_${response.status}`,
    error?.message ?? `The server refused the download (${response.status}).`,
    error?.field,
  );
}

/**
 * @param path the path under the API base, with its query, e.g. `/audit-events?format=csv`
 * @param filename the name the browser saves the file under
 * @param session the token, and what to do when the server says the session has ended
 */
export async function downloadAuthenticated(
  path: string,
  filename: string,
  session: { token: string | null; onUnauthorized: () => void },
): Promise<void> {
  if (typeof document === 'undefined') throw new ApiError(0, 'unsupported', 'Download from Tallyrun in a web browser.');
  let response: Response;
  try {
    response = await fetch(`${config.apiBaseUrl}${path}`, {
      headers: session.token ? { Authorization: `Bearer ${session.token}` } : {},
    });
  } catch {
    throw new ApiError(0, 'network_error', 'Cannot reach the Tallyrun server. Check the connection and try again.');
  }
  if (!response.ok) {
    if (response.status === 401 && session.token) session.onUnauthorized();
    throw await errorFromDownload(response);
  }
  const url = URL.createObjectURL(await response.blob());
  const link = document.createElement('a');
  link.href = url;
  link.download = filename;
  document.body.appendChild(link);
  link.click();
  link.remove();
  // The browser has taken the file once the click is handled; free the blob after that.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
