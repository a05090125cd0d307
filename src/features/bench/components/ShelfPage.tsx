import { useState } from "react";
import { Link } from "react-router-dom";
import { roleMay } from "@shared/access/roles";
import { formatNumber, formatQuantity } from "@shared/bench/format";
import { unitsByDimension, valueIn } from "@shared/bench/quantity";
import { partKindLabels, type PartView } from "@shared/bench/schemas";
import { searchShelf, shelfSortLabels, shelfSorts, sortShelf, type ShelfSort } from "@shared/bench/shelf";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { PageHeader } from "../../../components/PageHeader";
import { SelectField, TextField } from "../../../components/form-fields";
import { Empty, QueryState } from "../../../components/States";
import { formatMoney } from "../../../lib/format";
import { useChannel } from "../../../lib/session";
import { useAddPart } from "../api/add-part";
import { useParts } from "../api/list-parts";
import { Panel } from "./marks";
import { PartForm } from "./PartForm";

/** The channel's parts library, reused across episodes. */
export function ShelfPage() {
  const channel = useChannel();
  return <Shelf channelId={channel.channelId} channelName={channel.channelName} canWrite={roleMay(channel.role, "bench", "W")} />;
}

const dash = <span className="text-graphite-500">–</span>;
export const priceText = (part: PartView) => (part.price ? formatMoney(part.price.amount, part.price.currency) : null);
const massUnits = unitsByDimension.mass;
type MassUnit = (typeof massUnits)[number];

function Shelf({ channelId, channelName, canWrite }: { channelId: string; channelName: string; canWrite: boolean }) {
  const parts = useParts(channelId);
  const add = useAddPart(channelId);
  const [adding, setAdding] = useState(false);
  const [added, setAdded] = useState<string | null>(null);
  const [search, setSearch] = useState("");
  const [sort, setSort] = useState<ShelfSort>("name");
  const [massUnit, setMassUnit] = useState<MassUnit>("g");

  return (
    <div className="mx-auto max-w-5xl">
      <PageHeader
        title="Shelf"
        subtitle={`${channelName}'s parts: weighed, rated and priced once, measured in any episode.`}
        actions={canWrite && !adding ? <Button onClick={() => setAdding(true)}>Add a part</Button> : undefined}
      />
      {adding && (
        <Panel className="mb-6">
          <h2 className="mb-3 font-semibold">New part</h2>
          <PartForm
            busy={add.isPending}
            onSave={async (input) => {
              const part = await add.mutateAsync(input);
              setAdded(part.name);
            }}
            onCancel={() => setAdding(false)}
          />
        </Panel>
      )}
      {added && (
        <div className="mb-4">
          <Notice kind="success">{added} is on the shelf.</Notice>
        </div>
      )}
      <QueryState
        query={parts}
        loading="Loading the shelf…"
        page
        isEmpty={(list) => list.length === 0}
        empty={<Empty title="The shelf is empty">{canWrite ? "Add the motors, propellers, fans and packs you test." : "Parts appear here as the crew adds them."}</Empty>}
      >
        {(list) => {
          const shown = sortShelf(searchShelf(list, search), sort);
          return (
            <>
              <div className="mb-3 grid gap-3 sm:grid-cols-[2fr_1fr_1fr]" role="search" aria-label="Find parts on the shelf">
                <TextField label="Find a part" type="search" placeholder="Name, kind or supplier" value={search} onChange={(event) => setSearch(event.target.value)} />
                <SelectField label="Order" value={sort} onChange={(event) => setSort(event.target.value as ShelfSort)} options={shelfSorts.map((key) => ({ value: key, label: shelfSortLabels[key] }))} />
                <SelectField label="Masses in" value={massUnit} onChange={(event) => setMassUnit(event.target.value as MassUnit)} options={massUnits.map((unit) => ({ value: unit, label: unit }))} />
              </div>
              <p className="sr-only" role="status">
                {shown.length === list.length ? `${list.length} parts` : `${shown.length} of ${list.length} parts match`}
              </p>
              {shown.length === 0 ? (
                <Empty title="No part matches">Nothing on the shelf has “{search.trim()}” in its name, kind or supplier.</Empty>
              ) : (
                <div className="overflow-x-auto rounded-lg border border-ply-300 bg-white">
                  <table className="w-full text-sm">
                    <caption className="sr-only">Parts on the shelf</caption>
                    <thead className="border-b border-ply-300 bg-ply-50 text-left">
                      <tr>
                        {["Part", "Kind", `Mass (${massUnit})`, "Rated voltage", "Rated current", "Price", "Supplier", "Runs"].map((heading) => (
                          <th key={heading} scope="col" className="px-3 py-2 font-semibold">
                            {heading}
                          </th>
                        ))}
                      </tr>
                    </thead>
                    <tbody>
                      {shown.map((part) => (
                        <tr key={part.id} className="border-b border-ply-200 last:border-0">
                          <th scope="row" className="px-3 py-2 text-left font-medium">
                            <Link to={`/c/${channelId}/shelf/${part.id}`} className="text-rust-600 underline">
                              {part.name}
                            </Link>
                          </th>
                          <td className="px-3 py-2">{partKindLabels[part.kind]}</td>
                          <td className="px-3 py-2 tabular-nums" title={part.mass ? `Weighed as ${formatQuantity(part.mass)}` : undefined}>
                            {part.mass ? formatNumber(valueIn(part.mass, massUnit)) : dash}
                          </td>
                          <td className="px-3 py-2">{part.ratedVoltage ? formatQuantity(part.ratedVoltage) : part.powered ? dash : <span className="text-graphite-500">no power</span>}</td>
                          <td className="px-3 py-2">{part.ratedCurrent ? formatQuantity(part.ratedCurrent) : dash}</td>
                          <td className="px-3 py-2">{priceText(part) ?? dash}</td>
                          <td className="px-3 py-2">{part.supplier || dash}</td>
                          <td className="px-3 py-2 tabular-nums">{part.runCount}</td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                </div>
              )}
            </>
          );
        }}
      </QueryState>
    </div>
  );
}
