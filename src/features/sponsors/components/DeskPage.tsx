import { PageHeader } from "../../../components/PageHeader";
import { Empty } from "../../../components/States";

export function DeskPage() {
  return (
    <div>
      <PageHeader title="Desk" />
      <Empty title="Coming soon">This page is being built.</Empty>
    </div>
  );
}
