/**
 * Progress of a live run: how far λ has come from its start towards the target (a run always
 * has one), clamped to [0, 1]; λ moving back after a fold shows as progress going back. When the
 * target equals the start there is no distance to measure, and the count of points against the
 * point limit is shown instead, named as such. Pure.
 */
import type { FamilySettings } from '#shared/types/family'

export function runProgress(lambda: number, lambda0: number, settings: Pick<FamilySettings, 'to' | 'stop'>, points: number): { fraction: number, label: string } {
  const span = settings.to - lambda0
  const clamp = (x: number) => Math.min(1, Math.max(0, x))
  const fmt = (x: number) => String(Number(x.toPrecision(6)))
  if (Number.isFinite(lambda) && Number.isFinite(lambda0) && span !== 0) {
    const f = clamp((lambda - lambda0) / span)
    return { fraction: f, label: `λ = ${fmt(lambda)} on the way from ${fmt(lambda0)} to ${fmt(settings.to)} (${Math.round(100 * f)} %)` }
  }
  const f = clamp(points / settings.stop.maxPoints)
  return { fraction: f, label: `${points} of at most ${settings.stop.maxPoints} points (${Math.round(100 * f)} %)` }
}
