// Tailwind 4 reads its theme from CSS (src/styles/app.css, the @theme block); this file keeps the
// content globs in one place for editors and is loaded there through @config.
export default {
  content: ["./index.html", "./src/**/*.{ts,tsx}"],
};
