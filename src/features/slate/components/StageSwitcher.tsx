import { stageLabels, stages, type Stage } from "@shared/slate/stages";

const step = "rounded-md border border-ply-300 bg-ply-50 px-3 py-2 text-sm font-semibold hover:bg-ply-200 disabled:opacity-40";

/**
 * On a phone the board shows one stage at a time: this picks which, by the arrows on either side or
 * the menu between them, and says which stage is shown and how many episodes it holds.
 */
export function StageSwitcher({ shown, counts, onShow }: { shown: Stage; counts: Record<Stage, number>; onShow: (stage: Stage) => void }) {
  const index = stages.indexOf(shown);
  const count = counts[shown];
  return (
    <div role="group" aria-label="Stage shown" className="mb-3 flex flex-col gap-1 sm:hidden">
      <div className="flex items-center gap-2">
        <button type="button" className={step} disabled={index === 0} onClick={() => onShow(stages[index - 1]!)} aria-label="Previous stage">
          <span aria-hidden>‹</span>
        </button>
        <select aria-label="Stage" value={shown} onChange={(e) => onShow(e.target.value as Stage)} className="min-w-0 flex-1 rounded-md border border-ply-300 bg-white px-2 py-2 text-sm font-semibold">
          {stages.map((stage, i) => (
            <option key={stage} value={stage}>
              {i + 1} {stageLabels[stage]} ({counts[stage]})
            </option>
          ))}
        </select>
        <button type="button" className={step} disabled={index === stages.length - 1} onClick={() => onShow(stages[index + 1]!)} aria-label="Next stage">
          <span aria-hidden>›</span>
        </button>
      </div>
      <p role="status" className="text-xs text-graphite-500">
        {stageLabels[shown]}, stage {index + 1} of {stages.length}: {count === 0 ? "no episodes" : count === 1 ? "1 episode" : `${count} episodes`}
      </p>
    </div>
  );
}
