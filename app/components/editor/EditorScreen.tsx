// The gait editor on one screen, arranged for the job: the Timeline (gait
// diagram) and the Robot view side by side get the most room; the template
// parameters just above the Timeline, Playback and Checks under it; then Key
// details and Joint plots along the bottom.
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { useCallback, useEffect, useRef, useState } from "react";
import type { Sequence } from "~/gait";
import type { Robot } from "~/kinematics";
import { EditorStoreProvider, useEditor } from "~/stores/editor-context";
import { JointPlots } from "../joint-plots/JointPlots";
import { KeyDetails } from "../key-details/KeyDetails";
import { Timeline } from "../timeline/Timeline";
import { ChecksList } from "./ChecksList";
import { ConflictBanner, RestoreOffer } from "./DraftBanners";
import { EditorHeader } from "./EditorHeader";
import { GeneratorPanel } from "./GeneratorPanel";
import { HelpDialog } from "./HelpDialog";
import { PlaybackBar } from "./PlaybackBar";
import { RobotViewPanel } from "./RobotViewPanel";
import { useAutosave } from "./use-autosave";
import { usePlayback } from "./use-playback";
import { useServerReference } from "./use-server-reference";
import { useShortcuts } from "./use-shortcuts";

export type EditorScreenProps = {
  gait: { id: string; name: string; robotId: string; robotName: string };
  robot: Robot;
  sequence: Sequence;
  revision: number;
  updatedAt: string;
  robotRevision: number;
  newestRobotRevision: number;
  canEdit: boolean;
  canCommit: boolean;
};

export function EditorScreen(props: EditorScreenProps) {
  const [queryClient] = useState(() => new QueryClient());
  return (
    <QueryClientProvider client={queryClient}>
      <EditorStoreProvider init={{ robot: props.robot, sequence: props.sequence, revision: props.revision, readOnly: !props.canEdit }}>
        <EditorLayout {...props} />
      </EditorStoreProvider>
    </QueryClientProvider>
  );
}

/** How long the notice toast stays on screen; screen readers have it at once from the live region. */
const NOTICE_SHOWN_MS = 10_000;

function Announcer() {
  const notice = useEditor((state) => state.notice);
  const [hiddenId, setHiddenId] = useState<number | null>(null);
  useEffect(() => {
    if (!notice) return;
    const timer = setTimeout(() => setHiddenId(notice.id), NOTICE_SHOWN_MS);
    return () => clearTimeout(timer);
  }, [notice]);
  const shown = notice && notice.id !== hiddenId ? notice : null;
  return (
    // A toast at the window's foot: it takes no room above the timeline and stays in view wherever the page is scrolled.
    <p
      role="status"
      aria-live="polite"
      data-testid="editor-notice"
      className="pointer-events-none fixed inset-x-0 bottom-4 z-40 flex justify-center px-4 text-sm"
    >
      {shown ? (
        <span
          key={shown.id}
          className={`rounded-md border bg-surface px-3 py-1.5 shadow-lg ${shown.tone === "error" ? "border-danger text-danger" : "border-line text-ink"}`}
        >
          {shown.tone === "error" ? <span aria-hidden>▲ </span> : null}
          {shown.text}
        </span>
      ) : null}
    </p>
  );
}

function EditorLayout(props: EditorScreenProps) {
  const help = useRef<HTMLDialogElement>(null);
  const openHelp = useCallback(() => help.current?.showModal(), []);
  useShortcuts(openHelp);
  usePlayback();
  useAutosave(props.gait.id);
  const reference = useServerReference(props.gait.id);
  return (
    <div className="space-y-3" data-testid="gait-editor">
      <EditorHeader
        gait={props.gait}
        robotRevision={props.robotRevision}
        newestRobotRevision={props.newestRobotRevision}
        canCommit={props.canCommit}
        onHelp={openHelp}
      />
      {props.canEdit ? null : (
        <p className="rounded-md bg-sunken px-3 py-2 text-sm">
          {/* A drawn "i": the circled-i character is missing from common fonts and showed as an empty box. */}
          <span
            aria-hidden
            className="mr-1.5 inline-flex h-4 w-4 items-center justify-center rounded-full border border-ink-muted align-[-2px] text-[10px] font-semibold"
          >
            i
          </span>
          You can look at every frame and its checks; your role cannot change gaits.
        </p>
      )}
      <ConflictBanner gaitId={props.gait.id} gaitName={props.gait.name} robotRevision={props.robotRevision} />
      <RestoreOffer gaitId={props.gait.id} serverSequence={props.sequence} serverUpdatedAt={props.updatedAt} />
      <Announcer />
      {/* The parameters sit right above the timeline, so a stride change is seen there without scrolling (1280×800 and up). */}
      <div className="grid gap-3 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="min-w-0 space-y-3">
          <GeneratorPanel />
          <Timeline />
          <PlaybackBar />
          <ChecksList reference={reference} />
        </div>
        <RobotViewPanel />
      </div>
      <div className="grid gap-3 lg:grid-cols-2">
        <KeyDetails />
        <JointPlots />
      </div>
      <HelpDialog ref={help} />
    </div>
  );
}
