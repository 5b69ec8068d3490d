"""Room uses and surface elements: what each is judged by, and why; the timber and porous
material words."""

from __future__ import annotations

from dataclasses import dataclass

from survey.errors import InputError
from survey.thresholds.record import Threshold
from survey.thresholds.table import get

# --- room uses and their temperature-factor limits ---------------------------------------------

ROOM_USES: tuple[str, ...] = (
    "bedroom",
    "bathroom",
    "kitchen",
    "living",
    "basement",
    "crawlspace",
    "loft",
    "office",
    "storage",
    "hallway",
    "utility",
    "other",
)


@dataclass(frozen=True, slots=True)
class RoomUse:
    """What a room use means for the judgement and the advice, each with its reason.

    This is the one table of room-use rules: the temperature-factor limit (``frsi_key``,
    None where fRsi does not apply), and whether the room is a wet room (its humidity peaks
    after showers or cooking are normal), in contact with the ground (the ground, not
    outdoor air, sets its floor and wall temperatures), a confined space (a safety caution
    applies), a ventilated space that follows outdoor air (a loft, a crawl space), usually
    closed up and unoccupied (no occupants given: taken as 0), and which per-person moisture
    rate applies. ``ours`` marks an fRsi mapping that is our own decision rather than a use
    the cited source lists; ``frsi_reason`` says so."""

    use: str
    frsi_key: str | None
    frsi_reason: str
    ours: bool = False
    wet_room: bool = False
    ground_contact: bool = False
    confined: bool = False
    ventilated_space: bool = False
    closed_up: bool = False
    occupant_rate_key: str = "moisture_person_sedentary_g_per_h"

    @property
    def key(self) -> str | None:
        """The temperature-factor threshold key (the name the older table used)."""
        return self.frsi_key

    @property
    def reason(self) -> str:
        return self.frsi_reason


_WET_ROOM = "humidity peaks after showers, baths or cooking are the normal use of the room"
_GROUND = "walls and floor in contact with the ground, which sets their temperature"
_CONFINED = "a confined or hard-to-reach space: entry cautions apply"
_VENTILATED = "a ventilated space outside the heated envelope that follows outdoor air"
_CLOSED_UP = "usually closed up and unoccupied: no occupants given is taken as none"

ROOM_USE_POLICY: dict[str, RoomUse] = {
    u.use: u
    for u in (
        RoomUse(
            "bedroom",
            "frsi_dwelling",
            "a dwelling room (BRE IP1/06: dwellings 0.75)",
            occupant_rate_key="moisture_person_asleep_g_per_h",
        ),
        RoomUse("living", "frsi_dwelling", "a dwelling room (BRE IP1/06: dwellings 0.75)"),
        RoomUse(
            "office",
            "frsi_dwelling",
            "judged like a dwelling room (0.75): our choice, on the safe side; whether BRE "
            "IP1/06 lists offices at 0.75 or lower is not verified",
            ours=True,
        ),
        RoomUse(
            "hallway",
            "frsi_dwelling",
            "circulation space inside a dwelling, judged as a dwelling room (0.75): our choice",
            ours=True,
        ),
        RoomUse(
            "kitchen",
            "frsi_high_humidity",
            "BRE IP1/06 lists kitchens at 0.80 for their moisture bursts",
            wet_room=True,
        ),
        RoomUse(
            "bathroom",
            "frsi_high_humidity",
            "not listed in BRE IP1/06; treated like a kitchen (0.80) for its short, high "
            "moisture bursts: our choice, on the safe side",
            ours=True,
            wet_room=True,
        ),
        RoomUse(
            "basement",
            "frsi_dwelling",
            "a heated, habitable basement is a dwelling space (0.75): our choice",
            ours=True,
            ground_contact=True,
            confined=True,
            closed_up=True,
        ),
        RoomUse("storage", "frsi_storage", "BRE IP1/06: storage buildings 0.50", closed_up=True),
        RoomUse(
            "utility",
            "frsi_high_humidity",
            "a utility room, with laundry and its moisture bursts: treated like a kitchen "
            "(0.80), our choice on the safe side",
            ours=True,
            wet_room=True,
        ),
        RoomUse(
            "crawlspace",
            None,
            "an unheated space outside the heated envelope: no temperature-factor limit",
            ground_contact=True,
            confined=True,
            ventilated_space=True,
            closed_up=True,
        ),
        RoomUse(
            "loft",
            None,
            "an unheated roof space outside the heated envelope: no temperature-factor "
            "limit (a converted loft room is a bedroom or living room)",
            confined=True,
            ventilated_space=True,
            closed_up=True,
        ),
        RoomUse("other", "frsi_general", "general limit 0.70 (IEA Annex 14)"),
    )
}

#: Why each flag of :class:`RoomUse` is set, for the method section.
ROOM_USE_FLAG_REASONS: dict[str, str] = {
    "wet_room": _WET_ROOM,
    "ground_contact": _GROUND,
    "confined": _CONFINED,
    "ventilated_space": _VENTILATED,
    "closed_up": _CLOSED_UP,
}


def room_use(use: str) -> RoomUse:
    """The policy of a room use (canonical name)."""
    return ROOM_USE_POLICY[use]


# Views of the table, by the names other modules and the tests read.
UseLimit = RoomUse
FRSI_LIMIT_BY_USE: dict[str, RoomUse] = ROOM_USE_POLICY
#: Room uses that are confined or hard-to-reach spaces (a safety caution applies).
CONFINED_USES: frozenset[str] = frozenset(u for u, p in ROOM_USE_POLICY.items() if p.confined)
#: Occupant moisture rate by room use (threshold keys).
OCCUPANT_RATE_BY_USE: dict[str, str] = {u: p.occupant_rate_key for u, p in ROOM_USE_POLICY.items()}

#: Words in a material name or a surface label that mark it as timber (the one list).
TIMBER_WORDS: tuple[str, ...] = (
    "timber",
    "wood",
    "softwood",
    "hardwood",
    "pine",
    "spruce",
    "oak",
    "joist",
    "skirting",
    "floorboard",
    "batten",
    "rafter",
    "purlin",
    "truss",
    "sarking",
    "stud",
    "plywood",
    "osb",
    "chipboard",
    "particleboard",
    "architrave",
    "sill",
    "lath",
    "beam",
)


#: Words that mark a material as porous: soaked by category 3 water it is removed, not dried
#: (restoration standard of practice, secondary source; the list is common practice).
POROUS_WORDS: tuple[str, ...] = (
    "plasterboard",
    "gypsum",
    "drywall",
    "carpet",
    "underlay",
    "insulation",
    "mineral wool",
    "fibreglass",
    "fiberglass",
    "ceiling tile",
    "mdf",
    "chipboard",
    "particleboard",
    "fabric",
    "upholstery",
    "cardboard",
    "paper",
    "felt",
)


def is_porous(text: str) -> bool:
    """Whether a material name describes a porous material (removed after category 3)."""
    lowered = str(text).lower()
    return any(word in lowered for word in POROUS_WORDS)


def is_timber(text: str) -> bool:
    """Whether a material name or surface label describes timber."""
    lowered = str(text).lower()
    return any(word in lowered for word in TIMBER_WORDS)


#: Activities whose moisture rate is known, per hour of activity (threshold keys).
ACTIVITY_RATE: dict[str, str] = {
    "cooking": "moisture_cooking_g_per_h",
    "bath": "moisture_bath_g_per_h",
    "shower": "moisture_shower_g_per_h",
    "active_person": "moisture_person_active_g_per_h",
}


# --- surface elements: what each kind of surface is judged by ----------------------------------

#: The kinds of measured surface (the same list as the survey file model's ``Element``).
SURFACE_ELEMENTS: tuple[str, ...] = (
    "external_wall",
    "internal_wall",
    "ceiling",
    "floor",
    "window_frame",
    "glazing",
    "pipe",
    "other",
)


@dataclass(frozen=True, slots=True)
class ElementPolicy:
    """How a kind of surface is judged, and why (our policy; the reasons say on what)."""

    element: str
    role: str  #: "envelope", "internal", "glazing" or "pipe"
    temperature_factor: bool  #: judged against the room use's fRsi limit
    sets_room_target: bool  #: can be the coldest surface that caps the room RH
    mould_judged: bool  #: a surface that mould grows on
    words: str  #: e.g. "external wall"
    reason: str


_ENVELOPE_REASON = (
    "part of the heated envelope: the temperature factor (EN ISO 13788, "
    "BRE IP1/06) is defined for it, and mould on it sets the room RH"
)
ELEMENT_POLICY: dict[str, ElementPolicy] = {
    p.element: p
    for p in (
        ElementPolicy(
            "external_wall", "envelope", True, True, True, "external wall", _ENVELOPE_REASON
        ),
        ElementPolicy("ceiling", "envelope", True, True, True, "ceiling", _ENVELOPE_REASON),
        ElementPolicy("floor", "envelope", True, True, True, "floor", _ENVELOPE_REASON),
        ElementPolicy(
            "other",
            "envelope",
            True,
            True,
            True,
            "surface",
            "not said what it is: judged as a wall, ceiling or floor of the heated "
            "envelope, on the safe side",
        ),
        ElementPolicy(
            "internal_wall",
            "internal",
            False,
            True,
            True,
            "internal wall",
            "inside the heated envelope: no temperature factor (the outdoor "
            "temperature does not drive it), but mould on it sets the room RH",
        ),
        ElementPolicy(
            "window_frame",
            "glazing",
            False,
            False,
            True,
            "window frame",
            "judged for condensation and for mould on frames and seals; windows are "
            "expected to run colder than walls, so they do not set the room RH",
        ),
        ElementPolicy(
            "glazing",
            "glazing",
            False,
            False,
            False,
            "glazing",
            "judged for condensation only: glass does not feed mould, and single "
            "glazing fogging in winter is expected, no reason to hold the room drier",
        ),
        ElementPolicy(
            "pipe",
            "pipe",
            False,
            False,
            False,
            "pipe",
            "judged for condensation only: a cold pipe that sweats needs lagging, not a drier room",
        ),
    )
}


def check_element(element: str, field: str = "surface element") -> ElementPolicy:
    """The policy for a surface element; :class:`InputError` lists the elements allowed."""
    policy = ELEMENT_POLICY.get(element)
    if policy is None:
        text = str(element).strip().lower().replace(" ", "_").replace("-", "_")
        policy = ELEMENT_POLICY.get(text)
        if policy is None:
            raise InputError(field, element, "expected one of " + ", ".join(SURFACE_ELEMENTS))
    return policy


def check_use(use: str, field: str = "room use") -> str:
    """The room use in canonical form; :class:`InputError` lists the uses allowed."""
    text = str(use).strip().lower()
    if text not in FRSI_LIMIT_BY_USE:
        raise InputError(field, use, "expected one of " + ", ".join(ROOM_USES))
    return text


def frsi_limit(use: str) -> Threshold | None:
    """The temperature-factor limit for a room use, or None where fRsi does not apply."""
    key = FRSI_LIMIT_BY_USE[check_use(use)].key
    return None if key is None else get(key)
