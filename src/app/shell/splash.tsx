import { LoadingPanel } from '../../components/loading-panel';

export function Splash() {
  return <LoadingPanel label="Opening Nestkeeper…" className="justify-center py-24" />;
}
