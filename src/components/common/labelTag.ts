// The looks a LabelTag can take. Each area keeps its own table from its values (verdicts,
// camera states, work-order statuses) to a word, a Vant icon and one of these tones.

/** Colour schemes of the tag, named by what they look like (LabelTag.vue draws them). */
export type TagTone =
  | 'green-solid'
  | 'amber-solid'
  | 'red-solid'
  | 'teal-solid'
  | 'green-soft'
  | 'amber-soft'
  | 'teal-soft'
  | 'teal-soft-light-edge'
  | 'amber-outline'
  | 'teal-outline'
  | 'grey-struck'

export interface TagLook {
  /** The word shown; it must say everything on its own (colour only reinforces it). */
  label: string
  /** A Vant icon name. */
  icon: string
  tone: TagTone
}
