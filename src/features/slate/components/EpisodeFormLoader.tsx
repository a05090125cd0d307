import { lazyForm } from "../../../components/LazyForm";

/** The episode's form, fetched when a dialog first shows it: the slate and the episode page load without zod. */
export const EpisodeForm = lazyForm(() => import("./EpisodeForm").then((module) => module.EpisodeForm));
