"""Rooms and helpers the advice tests and the words tests share."""

from __future__ import annotations

import math

from CoolProp.HumidAirProp import HAPropsSI

from survey import advise, assess, words
from survey.advise import ActionKind
from survey.assess import (
    Accuracy,
    MaterialInput,
    Observations,
    OutdoorInput,
    RoomInput,
    SurfaceInput,
)

P = 101_325.0  # standard atmosphere at sea level, Pa (ASHRAE Fundamentals ch. 1 eqn 3) [R]


def coolprop(output: str, temp_c: float, rh_pct: float) -> float:
    return HAPropsSI(output, "T", temp_c + 273.15, "P", P, "R", rh_pct / 100.0)


def advice_for(room: RoomInput, outdoor: OutdoorInput | None, target=None, year=None):
    finding = assess.assess_room(room, outdoor, P, Accuracy())
    return finding, advise.advise_room(finding, target, year)


def action(advice, kind: ActionKind):
    (found,) = [a for a in advice.actions if a.kind is kind]
    return found


def winter_bedroom(occupants=2, volume=30.0):
    return RoomInput(
        "Bedroom",
        "bedroom",
        18.0,
        72.0,
        (SurfaceInput("north wall", 11.0), SurfaceInput("inner wall", 15.5)),
        volume_m3=volume,
        occupants=occupants,
    )


def wet_skirting_hall():
    return RoomInput(
        "Hall",
        "other",
        19.0,
        70.0,
        (SurfaceInput("wall", 15.0),),
        volume_m3=20.0,
        occupants=0,
        materials=(MaterialInput("skirting", "pine", 28.0, "mc_pct", 11.0, True),),
    )


def plain(**observations):
    return RoomInput("R", "living", 20.0, 50.0, observations=Observations(**observations))


def wmo_frost_point_c(temp_c: float, rh_pct: float) -> float:
    """WMO Guide No. 8 Annex 4.B (RH over water, e_w = 6.112 exp(17.62 t/(243.12 + t));
    frost where e_i = 6.112 exp(22.46 t/(272.62 + t)) equals it) [R, secondary]."""
    pw = rh_pct / 100.0 * 6.112 * math.exp(17.62 * temp_c / (243.12 + temp_c))
    x = math.log(pw / 6.112)
    return 272.62 * x / (22.46 - x)


def drying_room(drying: bool = True):
    materials = (
        MaterialInput("party wall", "plasterboard", 46.0, "relative", 22.0),
        MaterialInput("skirting", "softwood", 16.0, "mc_pct", 11.5, timber=True),
    )
    return RoomInput(
        "Family room",
        "basement",
        20.0,
        55.0,
        (SurfaceInput("screed", 17.0, "floor"),),
        volume_m3=50.0,
        occupants=0,
        materials=materials,
        observations=Observations(water_category=1, drying_in_progress=drying),
    )


# --- for the words tests -----------------------------------------------------------------

US_PINT_L = 0.473176  # 1 US liquid pint [R]
G_PER_LB = 453.59237  # 1 lb = 0.45359237 kg exactly [R]
GRAINS_PER_LB = 7000.0  # 7000 grains = 1 lb [R]
BTU_H_PER_W = 3600.0 / 1055.05585262  # 1 IT Btu = 1055.05585262 J (from memory): 3.412142 [C]
FT = 0.3048  # 1 ft = 0.3048 m exactly [R]


def reason_of(room, outdoor, kind: ActionKind, display=words.SI) -> str:
    """The reason of the room's one action of ``kind``, in ``display``'s units."""
    finding, advice = advice_for(room, outdoor)
    return words.action_reason(action(advice, kind), finding, advice, display)


def every_reason(finding, advice, display=words.SI) -> str:
    return " ".join(words.action_reason(a, finding, advice, display) for a in advice.actions)


def caution_texts(room, outdoor=None, year=None, display=words.SI) -> dict[str, str]:
    _, advice = advice_for(room, outdoor, year=year)
    return {c.key: words.caution_text(c, display) for c in advice.cautions}


def summer_basement(occupants=0):
    return RoomInput(
        "Basement",
        "basement",
        22.0,
        75.0,
        (SurfaceInput("slab", 17.0),),
        volume_m3=60.0,
        occupants=occupants,
    )


def up(value: float, places: int = 0) -> float:
    """``value`` rounded up at ``places`` decimals: a least figure is never shown below the
    one worked out."""
    return math.ceil(value * 10**places - 1e-9) / 10**places


def bedroom_two_cold_walls():
    """A bedroom at 16 °C / 75 % with two cold external walls (9.5 and 5.0 °C)."""
    return RoomInput(
        "Bedroom",
        "bedroom",
        16.0,
        75.0,
        (
            SurfaceInput("north wall", 9.5, "external_wall"),
            SurfaceInput("corner", 5.0, "external_wall"),
        ),
        volume_m3=30.0,
        occupants=2,
    )
