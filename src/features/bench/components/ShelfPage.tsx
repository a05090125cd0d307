import { PageHeader } from "../../../components/PageHeader";
import { Empty } from "../../../components/States";

export function ShelfPage() {
  return (
    <div>
      <PageHeader title="Shelf" />
      <Empty title="Coming soon">This page is being built.</Empty>
    </div>
  );
}
