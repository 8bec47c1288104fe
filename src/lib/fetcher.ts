// The client's one way to call the API: JSON in and out, errors as ApiError carrying the §9 code and details.
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: unknown,
  ) {
    super(message);
  }
}

export async function fetcher<T>(url: string, init?: RequestInit): Promise<T> {
  const response = await fetch(url, { ...init, headers: { accept: "application/json", ...(init?.headers ?? {}) } });
  if (!response.ok) {
    const body = (await response.json().catch(() => null)) as { error?: { code: string; message: string; details: unknown } } | null;
    throw new ApiError(response.status, body?.error?.code ?? "http_error", body?.error?.message ?? `HTTP ${response.status}`, body?.error?.details ?? null);
  }
  return (await response.json()) as T;
}

/** SWR keys, built in one place so revalidation can match them by prefix. */
export const keys = {
  jobs: (limit = 50) => `/api/v1/jobs?limit=${limit}`,
  job: (id: string) => `/api/v1/jobs/${id}`,
  lots: (query: Record<string, string | number | undefined>) => {
    const params = new URLSearchParams(Object.entries(query).flatMap(([k, v]) => (v === undefined || v === "" ? [] : [[k, String(v)]])));
    return `/api/v1/lots?${params.toString()}`;
  },
  dies: (lot: string, query: Record<string, string | number | undefined> = {}) => {
    const params = new URLSearchParams(Object.entries(query).flatMap(([k, v]) => (v === undefined || v === "" ? [] : [[k, String(v)]])));
    return `/api/v1/lots/${encodeURIComponent(lot)}/dies?${params.toString()}`;
  },
};
