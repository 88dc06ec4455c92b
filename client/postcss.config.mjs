// Tailwind v4 runs as a PostCSS plugin; it adds vendor prefixes itself (no autoprefixer).
export default { plugins: { '@tailwindcss/postcss': {} } };
