import { roleMay } from "@shared/access/roles";
import { PageHeader } from "../../../components/PageHeader";
import { useChannel } from "../../../lib/session";
import { FootageList } from "./FootageList";

/** Every clip of the channel, for the editor: filter, sort, preview, mark and export. */
export function RushesPage() {
  const channel = useChannel();
  return (
    <div>
      <PageHeader title="Rushes" subtitle="Every clip of the channel. Upload from an episode's page; find, mark and export here." />
      <FootageList channelId={channel.channelId} canDelete={roleMay(channel.role, "footage", "W") && channel.role !== "crew"} />
    </div>
  );
}
