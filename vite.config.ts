import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression } from 'vite-plugin-compression2';

/**
 * Text and font assets the build writes a `.br` and a `.gz` beside (server/middleware/static-assets.ts sends
 * them to a client that accepts them). WOFF and WOFF2 fonts are left out: they are compressed inside already
 * (zlib and brotli) and their copies saved under 1 %; raster images are compressed formats too.
 */
const COMPRESSIBLE = /\.(js|mjs|css|html|svg|json|ttf|otf|eot)$/;

// The client is built into dist/ and served by the Express server (server/app.ts).
export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
    // precompressed once at build, at the highest levels (gzip 9, brotli 11): files under 1 kB gain too little
    // for a second request path, and a variant no smaller than its file is not written (skipIfLargerOrEqual)
    compression({ include: COMPRESSIBLE, threshold: 1024, algorithms: ['brotliCompress', 'gzip'], skipIfLargerOrEqual: true, logLevel: 'silent' }),
  ],
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    chunkSizeWarningLimit: 1200,
    // brotli at quality 11 takes a few seconds inside a build hook; that is expected, not worth a timing warning
    rolldownOptions: { checks: { bundlerTimings: false } },
  },
  server: { port: 5179, proxy: { '/api': 'http://localhost:5178' } },
});
