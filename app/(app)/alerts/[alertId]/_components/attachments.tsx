import { formatDateTime } from "@/components/ui/format";

export interface AttachmentView { id: string; filename: string; contentType: string; sizeBytes: number; createdAt: string; uploaderName: string | null }

const size = (n: number) => (n >= 1048576 ? `${(n / 1048576).toFixed(1)} MiB` : `${Math.max(1, Math.round(n / 1024))} KiB`);

/** Photos as thumbnails (each opens the full image), PDFs as links; both served by the attachments route. */
export function AttachmentList({ alertId, items, timeZone }: { alertId: string; items: AttachmentView[]; timeZone: string }) {
  if (items.length === 0) return <p className="text-sm text-muted">No photo or document yet.</p>;
  const href = (id: string) => `/api/v1/alerts/${alertId}/attachments/${id}`;
  const images = items.filter((a) => a.contentType.startsWith("image/"));
  const docs = items.filter((a) => !a.contentType.startsWith("image/"));
  return (
    <div className="space-y-3" data-testid="alert-attachments">
      {images.length > 0 ? (
        <ul className="grid grid-cols-3 gap-2 sm:grid-cols-4">
          {images.map((a) => (
            <li key={a.id} data-attachment={a.filename}>
              <a href={href(a.id)} target="_blank" rel="noreferrer" className="block overflow-hidden rounded-md border border-line bg-sunken" title={a.filename}>
                {/* eslint-disable-next-line @next/next/no-img-element -- served by our authenticated route, not a static asset */}
                <img src={href(a.id)} alt={a.filename} loading="lazy" className="aspect-square w-full object-cover" />
              </a>
              <p className="mt-0.5 truncate text-xs text-muted">{a.filename}</p>
            </li>
          ))}
        </ul>
      ) : null}
      {docs.length > 0 ? (
        <ul className="space-y-1 text-sm">
          {docs.map((a) => (
            <li key={a.id} data-attachment={a.filename} className="flex flex-wrap items-baseline justify-between gap-2">
              <a href={href(a.id)} target="_blank" rel="noreferrer" className="text-accent underline-offset-2 hover:underline">PDF · {a.filename}</a>
              <span className="text-xs text-muted">{size(a.sizeBytes)} · {a.uploaderName ?? "former member"} · {formatDateTime(a.createdAt, timeZone)}</span>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
