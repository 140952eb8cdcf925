import { useFormikContext } from 'formik';
import { createContext, useCallback, useContext, useEffect, useState, type ReactNode } from 'react';
import { useBlocker } from 'react-router-dom';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';

type Report = (section: string, unsaved: boolean) => void;
const ReportContext = createContext<Report>(() => undefined);

/** Placed inside a section's form: tells the page whether that section has changes not yet saved. */
export function ReportUnsaved({ section }: { section: string }) {
  const { dirty } = useFormikContext();
  const report = useContext(ReportContext);
  useEffect(() => {
    report(section, dirty);
    return () => report(section, false);
  }, [report, section, dirty]);
  return null;
}

/**
 * Each settings section saves on its own; leaving the page (a link, Back, closing the tab) while one holds changes asks
 * first, naming the sections, so a half-edited section is never lost by a stray click.
 */
export function UnsavedChangesGuard({ children }: { children: ReactNode }) {
  const [unsaved, setUnsaved] = useState<readonly string[]>([]);
  const report = useCallback<Report>(
    (section, isUnsaved) => setUnsaved((now) => (now.includes(section) === isUnsaved ? now : isUnsaved ? [...now, section] : now.filter((s) => s !== section))),
    [],
  );
  const holding = unsaved.length > 0;
  const blocker = useBlocker(({ currentLocation, nextLocation }) => holding && currentLocation.pathname !== nextLocation.pathname);

  useEffect(() => {
    if (!holding) return;
    const ask = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener('beforeunload', ask);
    return () => window.removeEventListener('beforeunload', ask);
  }, [holding]);

  const names = new Intl.ListFormat('en', { type: 'conjunction' }).format(unsaved.map((s) => `“${s}”`));
  return (
    <ReportContext.Provider value={report}>
      {children}
      <Dialog
        open={blocker.state === 'blocked'}
        onClose={() => blocker.reset?.()}
        title="Leave without saving?"
        description={`${names} ${unsaved.length === 1 ? 'has' : 'have'} changes that are not saved. Leaving now discards them.`}
      >
        <div className="flex flex-wrap justify-end gap-2">
          <Button variant="primary" onClick={() => blocker.reset?.()}>
            Stay on this page
          </Button>
          <Button variant="danger" onClick={() => blocker.proceed?.()}>
            Leave and discard changes
          </Button>
        </div>
      </Dialog>
    </ReportContext.Provider>
  );
}
