import { useEffect, useRef } from 'react';

import type { ClockSnapshot } from '@/scene/playback/playback-clock';

/** Length of the tick, s. */
const TICK_S = 0.06;

/**
 * Plays a short tick (WebAudio oscillator) at each beat while `enabled`. The audio context is made
 * on the first enabled beat after the user turned sound on (browsers allow audio after a gesture).
 */
export function useBeatTick(snapshot: ClockSnapshot, enabled: boolean): void {
  const ctx = useRef<AudioContext | null>(null);
  const lastBeats = useRef(snapshot.beats);
  useEffect(() => {
    const beat = snapshot.beats !== lastBeats.current;
    lastBeats.current = snapshot.beats;
    if (!beat || !enabled || !snapshot.playing) return;
    const AC = typeof window !== 'undefined' ? (window.AudioContext ?? (window as unknown as { webkitAudioContext?: typeof AudioContext }).webkitAudioContext) : undefined;
    if (!AC) return;
    ctx.current ??= new AC();
    const ac = ctx.current;
    const osc = ac.createOscillator();
    const gain = ac.createGain();
    osc.frequency.value = snapshot.cycle ? 1320 : 880;
    gain.gain.setValueAtTime(0.15, ac.currentTime);
    gain.gain.exponentialRampToValueAtTime(0.001, ac.currentTime + TICK_S);
    osc.connect(gain).connect(ac.destination);
    osc.start();
    osc.stop(ac.currentTime + TICK_S);
  }, [snapshot.beats, snapshot.playing, snapshot.cycle, enabled]);
  useEffect(() => () => { void ctx.current?.close(); }, []);
}
