import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './app/app';
import { registerAppWorker } from './lib/app-updates';
import './styles/index.css';

const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element');

registerAppWorker();

createRoot(root).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
