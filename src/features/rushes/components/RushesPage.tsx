import { PageHeader } from "../../../components/PageHeader";
import { Empty } from "../../../components/States";

export function RushesPage() {
  return (
    <div>
      <PageHeader title="Rushes" />
      <Empty title="Coming soon">This page is being built.</Empty>
    </div>
  );
}
