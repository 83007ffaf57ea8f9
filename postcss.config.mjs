// Tailwind CSS 4 runs as a PostCSS plugin; the design tokens live in app/globals.css.
const config = {
  plugins: {
    "@tailwindcss/postcss": {},
  },
};

export default config;
