/**
 * The frame: a side list of screens, a top bar with the engine being worked on, the gap unit and
 * the demo loader, and the screen itself. Every move between screens passes the leave guard, so
 * unsaved edits are never dropped without asking.
 */
import { useCallback, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import type { ResponseOf } from '../../electron/ipc/channels.js';
import { EngineEditor } from '../screens/engines/EngineEditor.js';
import { EngineList } from '../screens/engines/EngineList.js';
import { PartsScreen } from '../screens/parts/PartsScreen.js';
import { RecordsScreen } from '../screens/records/RecordsScreen.js';
import { SheetScreen } from '../screens/sheet/SheetScreen.js';
import { WeighScreen } from '../screens/weigh/WeighScreen.js';
import { loadBenchPlan, saveBenchPlan, type BenchPlan } from './bench-plan.js';
import { call } from './bridge.js';
import { loadCurrentEngine, saveCurrentEngine, type CurrentEngine } from './current-engine.js';
import { DemoLoader } from './DemoLoader.js';
import { Confirm } from './Dialog.js';
import { LeaveGuardContext, type LeaveCheck, type LeaveGuard } from './leave-guard.js';
import { Notice, type NoticeKind } from './Notice.js';
import { RemovalProvider, useRemovalNotice } from './removal.js';
import { routeFromHash, routeToHash, screenOf, screens, type Route } from './routes.js';
import { loadSettings, saveSettings, settingsNow, settingsProblem, useSettings } from './settings.js';
import { UnitToggle } from './UnitToggle.js';
import { Unreadable } from './Unreadable.js';

type Flash = { kind: NoticeKind; text: string } | null;

export function App(): ReactNode {
  // The address names the screen after a reload; otherwise the last screen (from the settings, once read).
  const [route, setRoute] = useState<Route>(() => routeFromHash(window.location.hash) ?? { to: 'engines' });
  // Screens wait for the settings (mm/inch, the engine worked on, ticked plans) so none starts on a default.
  const [settled, setSettled] = useState(false);
  const [current, setCurrentState] = useState<CurrentEngine | null>(null);
  // Re-render when a setting changes, so a refused write (put back from the store) is explained.
  useSettings();
  const [bench, setBenchState] = useState<BenchPlan | null>(null);
  const [pending, setPending] = useState<{ route: Route; what: string } | null>(null);
  const [flash, setFlash] = useState<Flash>(null);
  const [listVersion, setListVersion] = useState(0);
  const [info, setInfo] = useState<ResponseOf<'app.info'> | null>(null);
  const checkRef = useRef<LeaveCheck | null>(null);
  const mainRef = useRef<HTMLElement>(null);
  const removal = useRemovalNotice(() => setListVersion((v) => v + 1));

  const guard = useMemo<LeaveGuard>(
    () => ({
      register(check) {
        checkRef.current = check;
        return () => {
          if (checkRef.current === check) checkRef.current = null;
        };
      },
    }),
    [],
  );

  const setCurrent = useCallback((c: CurrentEngine | null) => {
    setCurrentState(c);
    saveCurrentEngine(c);
  }, []);

  const setBench = useCallback((p: BenchPlan | null) => {
    setBenchState(p);
    saveBenchPlan(p);
  }, []);

  const go = useCallback((r: Route) => {
    setRoute(r);
    setFlash(null);
    // Move focus to the new screen's heading so keyboard and screen-reader users follow along.
    requestAnimationFrame(() => mainRef.current?.querySelector<HTMLElement>('h1')?.focus());
  }, []);

  const navigate = useCallback(
    (r: Route) => {
      const c = checkRef.current?.();
      if (c?.dirty) setPending({ route: r, what: c.what });
      else go(r);
    },
    [go],
  );

  useEffect(() => {
    void call('app.info', {}).then((r) => {
      if (r.ok) setInfo(r.value);
      else setFlash({ kind: 'problem', text: r.error.message });
    });
  }, []);

  // On start: the settings, then the remembered engine (it may have been deleted elsewhere) and,
  // unless the address names a screen, the screen the person was last on.
  useEffect(() => {
    let live = true;
    void (async () => {
      const s = await loadSettings();
      if (!live) return;
      // The id at once (screens start on it); its name, or that it is gone, one answer later.
      const remembered = s.workingEngineId;
      if (remembered !== null) setCurrentState({ id: remembered, name: '' });
      if (routeFromHash(window.location.hash) === null) setRoute({ to: s.lastScreen });
      setSettled(true);
      // The plan on the bench, read again (its name may have changed, or it may be gone).
      void loadBenchPlan().then((p) => live && setBenchState((b) => b ?? p));
      if (remembered === null) return;
      const engine = await loadCurrentEngine();
      if (live) setCurrentState((c) => (c && c.id === remembered && c.name === '' ? engine : c));
    })();
    return () => {
      live = false;
    };
    // Only on start: later changes come from the screens themselves.
  }, []);

  // The address follows the screen (replaceState: no history entry, nothing reloads), and the
  // settings keep the screen for the next start.
  useEffect(() => {
    if (!settled) return;
    const hash = routeToHash(route);
    if (window.location.hash !== hash) window.history.replaceState(null, '', `${window.location.pathname}${window.location.search}${hash}`);
    const screen = screenOf(route);
    if (settingsNow().lastScreen !== screen) void saveSettings({ lastScreen: screen });
  }, [route, settled]);


  const active = screenOf(route);
  let screen: ReactNode;
  switch (route.to) {
    case 'engines':
      screen = (
        <EngineList
          navigate={navigate}
          version={listVersion}
          onDeleted={(id) => {
            if (current?.id === id) setCurrent(null);
            if (bench?.engineId === id) setBench(null);
          }}
        />
      );
      break;
    case 'engine':
    case 'new-engine':
      screen = (
        <EngineEditor
          key={route.to === 'engine' ? `e${route.id}` : 'new'}
          id={route.to === 'engine' ? route.id : null}
          navigate={navigate}
          leave={go}
          onOpened={(e) => setCurrent({ id: e.id, name: e.name })}
          onDeleted={(id) => {
            if (current?.id === id) setCurrent(null);
            if (bench?.engineId === id) setBench(null);
          }}
        />
      );
      break;
    case 'parts':
      screen = <PartsScreen route={route} navigate={navigate} leave={go} version={listVersion} />;
      break;
    case 'combination':
      screen = <WeighScreen current={current} onEngineChosen={setCurrent} navigate={navigate} />;
      break;
    case 'sheet':
      screen = <SheetScreen planId={route.planId ?? null} current={current} bench={bench} onEngineChosen={setCurrent} onPlanChosen={setBench} navigate={navigate} />;
      break;
    case 'records':
      screen = <RecordsScreen onChanged={() => setListVersion((v) => v + 1)} version={listVersion} />;
      break;
  }

  return (
    <LeaveGuardContext.Provider value={guard}>
      <RemovalProvider value={removal.announce}>
      <a className="skip-link" href="#main">
        Skip to the screen
      </a>
      <div className="app">
        <header className="topbar">
          <span className="brand">Ignition Planner</span>
          <div className="working-on">
            {current ? (
              <button type="button" className="chip" onClick={() => navigate({ to: 'engine', id: current.id })} data-testid="current-engine">
                <span className="chip-label">Working on:</span> {current.name}
              </button>
            ) : (
              <span className="chip quiet" data-testid="current-engine">
                <span className="chip-label">Working on:</span> no engine chosen yet
              </span>
            )}
            {bench ? (
              <button type="button" className="chip" onClick={() => navigate({ to: 'sheet', planId: bench.id })} data-testid="bench-plan" title="Open the wiring sheet of the plan on the bench">
                <span className="chip-label">Plan on the bench:</span> {bench.name}
              </button>
            ) : null}
          </div>
          <div className="tools">
            <UnitToggle />
            <DemoLoader
              onLoaded={(text) => {
                setFlash({ kind: 'done', text });
                setListVersion((v) => v + 1);
              }}
              onProblem={(text) => setFlash({ kind: 'problem', text })}
            />
          </div>
        </header>
        <div className="body">
          <nav className="sidebar" aria-label="Screens">
            <ul>
              {screens.map((s) => (
                <li key={s.to}>
                  <button type="button" className="nav-item" aria-current={active === s.to ? 'page' : undefined} onClick={() => navigate({ to: s.to })}>
                    {s.label}
                  </button>
                </li>
              ))}
            </ul>
            {info ? (
              <p className="about" data-testid="about">
                Version {info.version}
                <br />
                Workshop folder: <span className="path">{info.dataDir}</span>
              </p>
            ) : null}
          </nav>
          <main id="main" ref={mainRef} tabIndex={-1}>
            {flash ? (
              <Notice kind={flash.kind} onDismiss={() => setFlash(null)} testId="flash">
                {flash.text}
              </Notice>
            ) : null}
            {removal.notice}
            {settingsProblem() ? (
              <Notice kind="problem" testId="settings-problem">
                {settingsProblem()}
              </Notice>
            ) : null}
            <Unreadable version={listVersion} onChanged={() => setListVersion((v) => v + 1)} />
            {settled ? screen : <p className="quiet" data-testid="opening">Opening the workshop…</p>}
          </main>
        </div>
      </div>
      {pending ? (
        <Confirm
          title="Leave without saving?"
          confirmLabel="Leave and lose the changes"
          cancelLabel="Stay and keep editing"
          danger
          onConfirm={() => {
            const to = pending.route;
            setPending(null);
            go(to);
          }}
          onCancel={() => setPending(null)}
          testId="leave-dialog"
        >
          <p>{pending.what} has changes that are not saved. Leaving now throws them away.</p>
        </Confirm>
      ) : null}
      </RemovalProvider>
    </LeaveGuardContext.Provider>
  );
}
