/** Entry point: installs the link guard and mounts the app. */
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './app/App.js';
import { bridge } from './app/bridge.js';
import { guardLinks } from './app/links.js';
import { loadSettings } from './app/settings.js';
import './styles/app.css';
import './styles/sheet.css';

// Read the access key (and clear it from the address bar) before anything renders.
bridge();
guardLinks();
// The settings (screen, mm/inch, the engine worked on) are read while React starts.
void loadSettings();

const root = document.getElementById('root');
if (root) {
  createRoot(root).render(
    <StrictMode>
      <App />
    </StrictMode>,
  );
}
