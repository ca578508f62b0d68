// Colours of measured data and markers, kept apart from the 8 element hues so neither is mistaken
// for a part's trace segment.

/** The measured load's dotted trace and its band-plot curve: a deep plum. */
export const MEASURED_HUE = '#6b3fa0'
/** Frequency markers on the chart and the band plot: a warm ochre. */
export const MARKER_HUE = '#b7791f'
