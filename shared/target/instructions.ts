// The words printed on page 2 of the target PDF and shown on the Targets screen. Plain words of
// our own; the safety notes are cautions that defer to local codes and employer procedures.

export interface InstructionSection {
  title: string
  items: string[]
}

export interface HowToFacts {
  scaleBarMm: number
  squareSideMm: number
}

function mm(v: number): string {
  return String(Math.round(v * 10) / 10)
}

export function targetHowTo(facts: HowToFacts): InstructionSection {
  return {
    title: 'Using this target',
    items: [
      'Print at 100 % (actual size). Switch off "fit to page", "shrink to fit" and any other scaling in the print dialog.',
      `Check the print with a ruler: the scale bar must measure ${mm(facts.scaleBarMm)} mm (within 1 %). If it does not, reprint; pixel density is worked out from the printed size.`,
      'Use matte paper. Gloss paper and plastic sleeves reflect light into the camera and spoil the edges.',
      'Mount the sheet flat on a stiff board, without curl or creases, and face it roughly square-on to the camera (a tilt of up to about 15° is fine).',
      `Place it where the camera's task matters, so that each ${mm(facts.squareSideMm)} mm square covers about 10–20 % of the frame width. Move closer or print larger if the squares look small.`,
      'Light it evenly: no shadows across the squares, no glare spots, no bright light behind it. For a night check, use the infrared illuminator the camera works with.',
      'Keep the camera as it is in service (no digital zoom), then capture a snapshot or a recorder export; several frames help.',
    ],
  }
}

export const FIELD_SAFETY: InstructionSection = {
  title: 'Safety on site',
  items: [
    "Local codes, site rules and your employer's procedures come first. These notes are reminders, not a replacement for them or for training.",
    'Work at height: focus remotely where you can. Use a ladder only for short, light work with three points of contact; lifts are for trained operators. Never use the phone while climbing.',
    'Roadside: follow the temporary traffic control rules that apply there and wear high-visibility clothing. Never stand in a live lane to hold a target; fix it in place or hold it from outside the traffic.',
    'Electrical: housings can carry mains, heater or illuminator power. Isolate and check it is dead before opening; mains work is for licensed electricians only.',
    'Infrared illuminators: do not look into a high-power illuminator at close range, even when it looks dark.',
    'Personal data: frames can show people and number plates. Frame the target, capture only what the check needs, upload as little as possible and keep it no longer than allowed.',
  ],
}
