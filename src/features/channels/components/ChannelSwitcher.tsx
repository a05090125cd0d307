import { useNavigate } from "react-router-dom";
import { roleLabels } from "@shared/access/roles";
import { useCurrentChannel, useMe } from "../../../lib/session";

/** Moves between the channels one account belongs to; the URL carries the channel. */
export function ChannelSwitcher() {
  const me = useMe();
  const current = useCurrentChannel();
  const navigate = useNavigate();
  const memberships = me.data?.memberships ?? [];
  return (
    <div className="flex items-center gap-2">
      <label htmlFor="channel-switcher" className="sr-only">
        Channel
      </label>
      <select
        id="channel-switcher"
        value={current?.channelId ?? ""}
        onChange={(event) => navigate(event.target.value === "new" ? "/channels/new" : `/c/${event.target.value}/home`)}
        className="max-w-80 rounded-md border border-graphite-700 bg-graphite-900 px-2 py-1 font-semibold text-ply-50 sm:max-w-32 md:max-w-48 lg:max-w-80"
      >
        {!current && <option value="">Pick a channel</option>}
        {memberships.map((m) => (
          <option key={m.channelId} value={m.channelId}>
            {m.channelName} ({roleLabels[m.role].toLowerCase()})
          </option>
        ))}
        <option value="new">+ New channel…</option>
      </select>
    </div>
  );
}
