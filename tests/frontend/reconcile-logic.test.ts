import { describe, expect, it } from 'vitest'
import { applyBody } from '../../frontend/src/logic/reconcile/reconcile-apply'
import {
  changedOptions,
  defaultOptions,
  optionTexts,
  parseOptions,
} from '../../frontend/src/logic/reconcile/reconcile-options'
import { formatTrend, signed } from '../../frontend/src/logic/reconcile/reconcile-words'
import { layoutShiftPlot } from '../../frontend/src/logic/reconcile/shift-plot'
import { layoutRotationStrip } from '../../frontend/src/logic/reconcile/rotation-strip'
import { reconciliationAnswer } from './reconcile-fixture'

const answer = reconciliationAnswer()

describe('parseOptions()', () => {
  it('parseOptions(): takes the defaults, refuses out-of-range and half-typed values without changing them', () => {
    expect(parseOptions(optionTexts(defaultOptions))).toEqual({
      options: defaultOptions,
      errors: {},
    })
    const texts = {
      ...optionTexts(defaultOptions),
      depthWindow: '0',
      minMatches: '2.5',
      maxAngle: '',
    }
    expect(parseOptions(texts)).toEqual({
      errors: {
        depthWindow: 'more than 0, at most 5 m',
        maxAngle: 'give a number',
        minMatches: 'must be a whole number',
      },
    })
    expect(parseOptions({ ...optionTexts(defaultOptions), depthWindow: '0,5' }).options).toEqual({
      ...defaultOptions,
      depthWindow: 0.5,
    })
  })

  it('changedOptions(): only what differs from the defaults goes into the query', () => {
    expect(changedOptions(defaultOptions)).toEqual({})
    expect(changedOptions({ ...defaultOptions, okAngle: 4 })).toEqual({ okAngle: 4 })
  })
})

describe('applyBody()', () => {
  it('applyBody(): nothing chosen → null; a run without a verdict is never sent', () => {
    expect(applyBody(answer, { depthShift: false, runIds: [], reason: '' })).toBeNull()
    expect(applyBody(answer, { depthShift: false, runIds: [13], reason: 'x' })).toBeNull()
    expect(applyBody(answer, { depthShift: false, runIds: [13, 11], reason: '  ' })).toEqual({
      runRotations: [{ runId: 11, rotation: 1.8 }],
    })
  })
})

describe('signed() and formatTrend()', () => {
  it('signed(): a true minus sign, and no sign on a value that rounds to zero', () => {
    expect(signed(-0.35, 3)).toBe('\u22120.350')
    expect(signed(0.35, 3)).toBe('+0.350')
    expect(signed(-0.0004, 3)).toBe('0.000')
  })

  it('formatTrend(): slope per metre shown per 10 m', () => {
    const trend = { slope: -0.0005, intercept: 0.3, referenceDepth: 40, slopeError: 0.0002 }
    expect(formatTrend(trend)).toBe('\u22120.005 m per 10 m (± 0.002)')
    expect(formatTrend(null)).toBe('')
  })
})

describe('layoutShiftPlot()', () => {
  it('layoutShiftPlot(): points at (core depth, difference), the shift level and the trend line on the same scales', () => {
    const plot = layoutShiftPlot(answer)
    const first = answer.matches[0]
    expect(plot.points[0].x).toBeCloseTo(plot.x(first.coreDepth), 9)
    expect(plot.points[0].y).toBeCloseTo(plot.y(first.depthDifference), 9)
    expect(plot.y.invert(plot.shift!.y)).toBeCloseTo(answer.depthShift!, 9)
    expect(plot.y.invert(plot.shift!.bandTop) - plot.y.invert(plot.shift!.bandBottom)).toBeCloseTo(
      0.08,
      9,
    )
    // The trend line is intercept + slope · (depth − reference) (the API's model): its rise over
    // the plotted depth span is slope · span.
    const [d0, d1] = plot.x.domain()
    const rise = plot.y.invert(plot.trend!.y2) - plot.y.invert(plot.trend!.y1)
    expect(rise).toBeCloseTo(0.0012 * (d1 - d0), 9)
    expect(plot.y.invert(plot.trend!.y1)).toBeCloseTo(0.35 + 0.0012 * (d0 - 43.5), 9)
    // Larger differences sit higher: the y axis runs up the page.
    expect(plot.y(0.4)).toBeLessThan(plot.y(0.3))
  })

  it('layoutRotationStrip(): a bar per run at its rotation over its span; none for a run without an estimate', () => {
    const strip = layoutRotationStrip(answer)
    const [r11, r12, r13] = strip.runs
    expect(strip.y.invert(r12.estimate!.y)).toBeCloseTo(24.6, 9)
    expect(strip.y.invert(r12.estimate!.bandTop)).toBeCloseTo(28, 9)
    expect(r12.x).toBeCloseTo(strip.x(42), 9)
    expect(r12.width).toBeCloseTo(strip.x(45) - strip.x(42), 9)
    expect(strip.y.invert(r11.appliedY)).toBeCloseTo(1.5, 9)
    expect(r13.estimate).toBeNull()
  })
})
