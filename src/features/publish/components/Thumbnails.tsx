import { thumbnailPreviewSizes } from "@shared/publish/thumbnail";
import type { ThumbnailView } from "@shared/publish/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { formatSize } from "../../../lib/format";
import { useAddThumbnail } from "../api/add-thumbnail";
import { useRemoveThumbnail } from "../api/remove-thumbnail";

interface Props {
  channelId: string;
  episodeId: string;
  thumbnails: ThumbnailView[];
  chosen: string | null;
  choose: (id: string | null) => void;
  canWrite: boolean;
}

function Candidate({ thumbnail, chosen, choose, remove, canWrite }: { thumbnail: ThumbnailView; chosen: boolean; choose: () => void; remove: () => void; canWrite: boolean }) {
  const size = thumbnail.width && thumbnail.height ? `${thumbnail.width} × ${thumbnail.height}` : "size unknown";
  return (
    <li className={`space-y-2 rounded-md border p-3 ${chosen ? "border-rust-600" : "border-ply-300"}`}>
      <div className="flex flex-wrap items-end gap-3">
        {thumbnailPreviewSizes.map((preview) => (
          <figure key={preview.width} className="min-w-0 max-w-full space-y-1">
            <img src={thumbnail.url} alt={`${thumbnail.fileName} at ${preview.width} × ${preview.height}`} width={preview.width} height={preview.height} className="h-auto max-w-full rounded object-cover" style={{ aspectRatio: "16 / 9" }} />
            <figcaption className="text-xs text-graphite-500">
              {preview.width} × {preview.height}
            </figcaption>
          </figure>
        ))}
      </div>
      <p className="text-sm text-graphite-700">
        {thumbnail.fileName}: {size}, {formatSize(thumbnail.size)}
      </p>
      {thumbnail.problems.length === 0 ? (
        <p className="text-xs text-moss-600">Keeps the platform&apos;s thumbnail rules.</p>
      ) : (
        <ul className="list-disc pl-5 text-xs text-alarm-600">
          {thumbnail.problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      )}
      {canWrite && (
        <div className="flex flex-wrap gap-2">
          <label className="flex items-center gap-2 text-sm">
            <input type="radio" name="chosen-thumbnail" className="size-4 accent-rust-600" checked={chosen} onChange={choose} />
            Use {thumbnail.fileName}
          </label>
          <Button tone="quiet" type="button" onClick={remove} aria-label={`Remove ${thumbnail.fileName}`}>
            Remove
          </Button>
        </div>
      )}
    </li>
  );
}

/** Candidate pictures, each shown at the sizes viewers meet it, with the platform's rules it breaks. */
export function Thumbnails({ channelId, episodeId, thumbnails, chosen, choose, canWrite }: Props) {
  const add = useAddThumbnail(channelId, episodeId);
  const remove = useRemoveThumbnail(channelId, episodeId);
  return (
    <fieldset className="min-w-0 space-y-2">
      <legend className="font-semibold text-graphite-900">Thumbnail</legend>
      <p className="text-xs text-graphite-500">The platform asks for 1280 × 720 (at least 640 wide), 16:9, JPG, GIF or PNG, under 2 MB.</p>
      {thumbnails.length === 0 && <p className="text-sm text-graphite-700">No thumbnails yet.</p>}
      <ul className="space-y-2">
        {thumbnails.map((t) => (
          <Candidate key={t.id} thumbnail={t} chosen={chosen === t.id} canWrite={canWrite} choose={() => choose(t.id)} remove={() => remove.mutate(t.id, { onSuccess: () => chosen === t.id && choose(null) })} />
        ))}
      </ul>
      {canWrite && (
        <label className="block text-sm font-medium text-graphite-700">
          Add a thumbnail
          <input type="file" accept=".jpg,.jpeg,.png,.gif,image/jpeg,image/png,image/gif" className="mt-1 block w-full text-sm" disabled={add.isPending} onChange={(e) => e.target.files?.[0] && add.mutate(e.target.files[0])} />
        </label>
      )}
      {add.isPending && <p role="status" className="text-sm">Uploading the picture…</p>}
      {add.error && <Notice kind="error">{add.error.message}</Notice>}
      {remove.error && <Notice kind="error">{remove.error.message}</Notice>}
    </fieldset>
  );
}
