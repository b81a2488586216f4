/** The page's entry: start once the document is parsed (main.ts does nothing at import). */
import { start } from './main.js';

if (document.readyState === 'loading') document.addEventListener('DOMContentLoaded', () => void start(), { once: true });
else void start();
