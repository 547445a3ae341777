/**
 * The player's clock, outside React: the render loop advances it every frame (no re-render), and the
 * controls subscribe to a snapshot that changes only on discrete events (step, cycle, play state,
 * speed, loop) or every TIME_TICK_S of playback, so the overlay re-renders a few times a second.
 */
import { cycleAt, cycleNumberAt, stepIndexAt, type StepSpan } from './step-position';

/** What the overlay shows; a new object only when something in it changed. */
export interface ClockSnapshot {
  /** Playback time, s, rounded down to TIME_TICK_S. */
  time: number;
  playing: boolean;
  /** × real time. */
  speed: number;
  /** Index of the step held in a loop, or null. */
  loopStep: number | null;
  /** Current step index. */
  step: number;
  /** Current cycle of a cyclic step, else null. */
  cycle: { cycle: number; of: number } | null;
  /** Counts beats (cycle starts and step starts reached while playing). */
  beats: number;
  /** True once playback reached the end (cleared by seek or play). */
  ended: boolean;
  /** Steps entered while playing through (for the log's "completed steps"). */
  completedSteps: number;
}

/** Snapshot time resolution, s. */
export const TIME_TICK_S = 0.1;

/** Playback state with subscribe/getSnapshot for React's useSyncExternalStore. */
export class PlaybackClock {
  /** Playback time, s (read by the render loop every frame). */
  t = 0;
  /** Wall time (s, performance.now()/1000) of the last beat, for the flash. */
  lastBeatWall = -Infinity;
  private snap: ClockSnapshot;
  private readonly listeners = new Set<() => void>();
  /** Highest step index whose end was passed while playing. */
  private passed = -1;

  constructor(readonly duration: number, readonly steps: readonly StepSpan[], speed = 1) {
    this.snap = { time: 0, playing: false, speed, loopStep: null, step: 0, cycle: steps.length ? cycleAt(steps[0], 0) : null, beats: 0, ended: false, completedSteps: 0 };
  }

  /** The current snapshot (stable between changes). */
  getSnapshot = (): ClockSnapshot => this.snap;

  /** Subscribes to snapshot changes; returns the unsubscribe function. */
  subscribe = (fn: () => void): (() => void) => {
    this.listeners.add(fn);
    return () => this.listeners.delete(fn);
  };

  private publish(patch: Partial<ClockSnapshot>): void {
    this.snap = { ...this.snap, ...patch };
    for (const fn of this.listeners) fn();
  }

  /** Start and end of the playable window (the looped step, or the whole sequence), s. */
  private windowStart(): number {
    const l = this.snap.loopStep;
    return l === null || !this.steps[l] ? 0 : this.steps[l].start;
  }
  private windowEnd(): number {
    const l = this.snap.loopStep;
    return l === null || !this.steps[l] ? this.duration : this.steps[l].end;
  }

  /**
   * Recomputes the discrete parts for the current t and publishes when they changed. Called every
   * frame: allocates only when it publishes (a few times a second).
   */
  private sync(extra?: Partial<ClockSnapshot>, beat = false): void {
    const step = stepIndexAt(this.steps, this.t);
    const cycleNo = this.steps.length ? cycleNumberAt(this.steps[step], this.t) : 0;
    const time = Math.floor(this.t / TIME_TICK_S + 1e-9) * TIME_TICK_S;
    const s = this.snap;
    let changed = beat || step !== s.step || cycleNo !== (s.cycle?.cycle ?? 0) || time !== s.time || this.passed + 1 !== s.completedSteps;
    if (extra && !changed) for (const k in extra) if (s[k as keyof ClockSnapshot] !== extra[k as keyof ClockSnapshot]) changed = true;
    if (!changed) return;
    const cycle = this.steps.length ? cycleAt(this.steps[step], this.t) : null;
    this.publish({ step, cycle, time, ...extra, ...(beat ? { beats: s.beats + 1 } : {}), completedSteps: this.passed + 1 });
  }

  /**
   * Advances by `dtReal` seconds of wall time × speed (called each frame while mounted). Emits a beat
   * when a cycle or step starts during the advance; stops at the end, or wraps within a looped step.
   * `wallNow` (s) stamps the beat for the flash.
   */
  advance(dtReal: number, wallNow: number): void {
    if (!this.snap.playing || dtReal <= 0) return;
    const before = this.t;
    const w0 = this.windowStart(), w1 = this.windowEnd();
    let t = before + Math.min(dtReal, 0.25) * this.snap.speed;
    let wrapped = false;
    if (t >= w1) {
      if (this.snap.loopStep !== null) { t = w0 + ((t - w0) % Math.max(1e-6, w1 - w0)); wrapped = true; }
      else t = w1;
    }
    const stepBefore = stepIndexAt(this.steps, before);
    const stepAfter = stepIndexAt(this.steps, t);
    const cycBefore = this.steps.length ? cycleNumberAt(this.steps[stepBefore], before) : 0;
    const cycAfter = this.steps.length ? cycleNumberAt(this.steps[stepAfter], t) : 0;
    const beat = wrapped || stepAfter !== stepBefore || cycAfter !== cycBefore;
    // Steps whose end was crossed while playing count as completed.
    for (let i = stepBefore; i < this.steps.length; i++) if (this.steps[i].end <= t + 1e-9 && i > this.passed) this.passed = i;
    if (stepAfter > stepBefore) this.passed = Math.max(this.passed, stepAfter - 1);
    this.t = t;
    if (beat) this.lastBeatWall = wallNow;
    const ended = this.snap.loopStep === null && t >= this.duration;
    this.sync(ended ? { playing: false, ended: true } : undefined, beat);
  }

  /** Play; from the start when at the end. */
  play(): void {
    if (this.t >= this.windowEnd() - 1e-9) this.t = this.windowStart();
    this.sync({ playing: true, ended: false });
  }

  /** Pause. */
  pause(): void {
    this.sync({ playing: false });
  }

  /** Toggle play/pause. */
  toggle(): void {
    if (this.snap.playing) this.pause(); else this.play();
  }

  /** Jump to t (clamped to the sequence). Does not count steps as completed. */
  seek(t: number): void {
    this.t = Math.min(this.duration, Math.max(0, t));
    this.sync({ ended: false });
  }

  /** Set the speed (× real time). */
  setSpeed(speed: number): void {
    this.sync({ speed });
  }

  /** Jump to the start of step i (clamped). */
  goToStep(i: number): void {
    const k = Math.min(this.steps.length - 1, Math.max(0, i));
    if (this.steps[k]) this.seek(this.steps[k].start);
    if (this.snap.loopStep !== null) this.sync({ loopStep: k });
  }

  /** Next / previous step. */
  nextStep(): void { this.goToStep(this.snap.step + 1); }
  prevStep(): void {
    // Within the first second of a step, go to the previous one; otherwise to this step's start.
    const cur = this.steps[this.snap.step];
    this.goToStep(cur && this.t - cur.start > 1 ? this.snap.step : this.snap.step - 1);
  }

  /** Loop the current step (or stop looping). */
  toggleLoop(): void {
    this.sync({ loopStep: this.snap.loopStep === null ? this.snap.step : null });
  }
}
