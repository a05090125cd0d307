import { useEffect } from "react";
import { useLocation } from "react-router-dom";

/**
 * A link that names a part of a page (`…/episodes/<id>#test-plan`, from the home) lands on that part.
 * The browser does this by itself only for parts present at load; a page whose parts appear once its
 * data has come calls this where they are rendered.
 */
export function useScrollToHash(): void {
  const { hash, key } = useLocation();
  useEffect(() => {
    if (!hash) return;
    document.getElementById(decodeURIComponent(hash.slice(1)))?.scrollIntoView({ block: "start" });
  }, [hash, key]);
}
