// Proxy of `npm run serve:console` (the Angular dev server): the API, the element script and the embedding
// demo come from a running Polewright server (POLEWRIGHT_API, default http://localhost:4300).
const target = process.env.POLEWRIGHT_API ?? 'http://localhost:4300';
export default {
  '/api': { target, changeOrigin: false },
  '/elements': { target, changeOrigin: false },
  '/embed-demo': { target, changeOrigin: false },
};
