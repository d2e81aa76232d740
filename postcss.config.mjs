/** PostCSS runs Tailwind CSS 4 (its config: tailwind.config.ts, named from app/globals.css). */
const config = {
  plugins: { "@tailwindcss/postcss": {} },
};

export default config;
