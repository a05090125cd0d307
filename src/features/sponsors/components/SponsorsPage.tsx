import { PageHeader } from "../../../components/PageHeader";
import { Empty } from "../../../components/States";

export function SponsorsPage() {
  return (
    <div>
      <PageHeader title="Sponsors" />
      <Empty title="Coming soon">This page is being built.</Empty>
    </div>
  );
}
