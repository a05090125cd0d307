import "./styles/app.css";

/*
 * The opening screen in index.html paints before the app's code is fetched: on a phone's network the
 * screen shows Kerf at once instead of after a few hundred kilobytes. Then the page's code, listed by
 * the server in the page (server/http/page-preloads.ts), is asked for all at once, and the app starts.
 */

/** After the browser has painted (or a tenth of a second, where frames are not drawn: a hidden tab). */
function afterFirstPaint(): Promise<void> {
  return new Promise((resolve) => {
    requestAnimationFrame(() => setTimeout(resolve, 0));
    setTimeout(resolve, 100);
  });
}

function askForPageCode(): void {
  const list = document.getElementById("kerf-page-code")?.textContent;
  for (const href of list ? (JSON.parse(list) as string[]) : []) {
    const link = document.createElement("link");
    link.rel = "modulepreload";
    link.crossOrigin = "";
    link.href = href;
    document.head.append(link);
  }
}

void afterFirstPaint().then(() => {
  askForPageCode();
  return import("./app/start");
});
