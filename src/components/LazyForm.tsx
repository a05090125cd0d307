import { lazy, Suspense, type ComponentType } from "react";
import { Loading } from "./States";

/**
 * A form whose code (with zod and the shared schemas it checks against) is fetched when it is first
 * shown, not with the page that holds it: a page's read view paints without them. Until the code is
 * there the form's place says "Loading…"; its first field takes the focus when it comes
 * (`autoFocus`, or `FormOpener`'s watch). `preload` starts the fetch early, on a sign the form is wanted.
 */
export function lazyForm<P extends object>(load: () => Promise<ComponentType<P>>): ComponentType<P> & { preload: () => Promise<unknown> } {
  const Form = lazy(async () => ({ default: await load() }));
  const Shown = (props: P) => (
    <Suspense fallback={<Loading />}>
      <Form {...props} />
    </Suspense>
  );
  return Object.assign(Shown, { preload: load });
}
