// Module hooks for import-each.mjs: a module imported with `?fresh=N` gets its own copy of every repo
// module it reaches (the query is passed down), while packages in node_modules load once and are shared.
export async function resolve(specifier, context, next) {
  const result = await next(specifier, context);
  const generation = context.parentURL?.startsWith("file:") ? new URL(context.parentURL).searchParams.get("fresh") : null;
  if (generation && result.url.startsWith("file:") && !result.url.includes("/node_modules/")) {
    const url = new URL(result.url);
    url.searchParams.set("fresh", generation);
    return { ...result, url: url.href };
  }
  return result;
}
