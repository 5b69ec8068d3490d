"""A survey's logger series turned into surface series, and judged by the mould-growth index.

A surface's conditions come from one of two kinds of logger series:

* a logger on the surface (``LogSeries.surface`` names the surface's location): its samples
  are the surface temperature and surface RH, used as they are;
* a logger in the room's air, with the surface's temperature factor fRsi measured on a visit and
  an outdoor logger. At each room sample the outdoor temperature θe is interpolated in time
  between the outdoor samples either side (none within 6 h: the room sample is left out and
  counted), the surface temperature is θsi = θe + fRsi (θi − θe), and the surface RH is the
  room air's vapour pressure over the saturation pressure at θsi (:mod:`survey.psychro`, water
  at every temperature as the model's RH is), capped at 100 % (water forming). This assumes the
  factor measured on the day holds at every hour: a steady state, with no lag from the wall's
  heat storage, no sun and no heating cycles on the surface itself.

The class of the surface's material is chosen by :func:`choose_class` from
the surface reading's material, its label and its element. Errors name the quantity
("room", "surface", "series", "sensitivity class", "outdoor series"); a face re-labels them.
"""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass

from survey import evaluate, model, psychro
from survey import thresholds as th
from survey.errors import InputError
from survey.mould_index import (
    CLASS_KEYS,
    CLASSES,
    DEFAULT_CLASS,
    ClassChoice,
    MouldIndexResult,
    SurfaceSeries,
    analyse,
)
from survey.safe_text import count_cut
from survey.thresholds.policy import POROUS_WORDS, is_timber

_HOUR = dt.timedelta(hours=1)

#: The words that set a material's class, tried in this order on the material, then on the
#: label; the first rule with a word in the text decides. The classes are Ojanen, Viitanen
#: et al. (2010): very sensitive (untreated wood), sensitive (planed wood, paper-coated
#: products, wood-based boards), medium resistant (cement- and plastic-based materials,
#: mineral fibres), resistant (glass and metal) (from memory; an R package's documentation
#: lists pine sapwood / glued boards, paper-faced foam, spruce / concrete, glass wool /
#: polished foam, read). Which word falls in which class, and the order, are our choice from
#: that classification:
#:
#: 1. timber (:func:`survey.thresholds.is_timber`, whose words include plywood, OSB and
#:    chipboard) is very sensitive: sawn, untreated pine sapwood is what the model was
#:    fitted to, the safe side for any wood;
#: 2. paper-faced boards, wood-based boards and organic finishes (paint, wallpaper) are
#:    sensitive, before any mineral word: the face is what mould grows on, so "painted
#:    plaster" and "plasterboard" are sensitive although "plaster" alone is not;
#: 3. mineral fibres are medium resistant, before "glass" and "insulation" below;
#: 4. plaster, render, mortar, concrete, cement, screed, brick, block, masonry and stone are
#:    medium resistant ("gypsum plaster" among them: a plaster, not a board);
#: 5. plastics are medium resistant, before "insulation" below;
#: 6. the other porous materials (:data:`survey.thresholds.POROUS_WORDS`: carpet, underlay,
#:    insulation, ceiling tiles, fabric, bare "gypsum" read as board …) and sealants,
#:    cork and textiles are sensitive;
#: 7. glass, metal and glazed ceramics are resistant.
BOARD_AND_FINISH_WORDS = (
    "plasterboard", "gypsum board", "gypsum wallboard", "wallboard", "drywall",
    "paper-faced", "paper faced", "paper", "cardboard", "mdf", "chipboard",
    "particleboard", "hardboard", "fibreboard", "fiberboard", "paint", "emulsion",
    "distemper",
)  # fmt: skip
MINERAL_FIBRE_WORDS = (
    "mineral wool", "glass wool", "rock wool", "stone wool", "fibreglass", "fiberglass",
)  # fmt: skip
MINERAL_WORDS = (
    "plaster", "render", "mortar", "concrete", "cement", "screed", "brick", "block",
    "masonry", "stone", "lime",
)  # fmt: skip
PLASTIC_WORDS = ("pvc", "plastic", "polystyrene", "polyurethane", "vinyl")
OTHER_SENSITIVE_WORDS = (*POROUS_WORDS, "cork", "silicone", "sealant", "textile")
RESISTANT_WORDS = (
    "glass", "metal", "steel", "aluminium", "aluminum", "copper", "zinc", "ceramic",
    "porcelain", "glazed tile",
)  # fmt: skip
#: The rules after timber, in their order: (class key, words).
CLASS_RULES: tuple[tuple[str, tuple[str, ...]], ...] = (
    ("sensitive", BOARD_AND_FINISH_WORDS),
    ("medium_resistant", MINERAL_FIBRE_WORDS),
    ("medium_resistant", MINERAL_WORDS),
    ("medium_resistant", PLASTIC_WORDS),
    ("sensitive", OTHER_SENSITIVE_WORDS),
    ("resistant", RESISTANT_WORDS),
)
#: Elements that decide a class when no word does.
ELEMENT_CLASS = {"glazing": "resistant", "pipe": "resistant"}


def _class_from_text(text: str) -> tuple[str, str] | None:
    """The class and the word that set it, by :data:`CLASS_RULES` after timber."""
    lowered = text.lower()
    if is_timber(lowered):
        word = next(w for w in th.TIMBER_WORDS if w in lowered)
        return "very_sensitive", word
    for key, words in CLASS_RULES:
        found = next((w for w in words if w in lowered), None)
        if found is not None:
            return key, found
    return None


def choose_class(
    material: str = "", label: str = "", element: str = "", stated: str | None = None
) -> ClassChoice:
    """The sensitivity class for a surface: ``stated`` if given (a key of :data:`CLASSES`),
    else by the words of its material, then of its label, then by its element, else
    :data:`DEFAULT_CLASS`."""
    if stated is not None:
        if stated not in CLASSES:
            raise InputError("sensitivity class", stated, f"one of {', '.join(CLASS_KEYS)}")
        return ClassChoice(stated, "stated")
    for basis, text in (("material", material), ("label", label)):
        found = _class_from_text(text)
        if found is not None:
            return ClassChoice(found[0], basis, found[1])
    if element in ELEMENT_CLASS:
        return ClassChoice(ELEMENT_CLASS[element], "element", element)
    return ClassChoice(DEFAULT_CLASS, "default")


@dataclass(frozen=True, slots=True)
class SeriesSource:
    """What a surface series was made from."""

    log_index: int  #: position in ``survey.logs``
    source: str  #: the logger file's name
    room: str  #: ``Room.id``
    surface: str | None  #: the surface's location label (None: not known)
    material: str
    element: str
    frsi: float | None = None  #: the temperature factor used (air loggers only)
    frsi_visit: int | None = None  #: the visit it was measured on, 1 is the first
    outdoor_sources: tuple[str, ...] = ()
    left_out: int = 0  #: room samples with no outdoor reading near enough


@dataclass(frozen=True, slots=True)
class LogIndex:
    """One logger series judged: where it came from and the index over it."""

    source: SeriesSource
    result: MouldIndexResult


#: Why a room's series could not be judged (for :class:`LogNotJudged`).
NOT_JUDGED_REASONS = ("no_factor", "no_outdoor", "outdoor_gap", "too_few", "times_mixed")


@dataclass(frozen=True, slots=True)
class LogNotJudged:
    """A room's series the report could not judge, and why (a key of
    :data:`NOT_JUDGED_REASONS`)."""

    log_index: int
    source: str
    room: str
    reason: str


def _fold(text: str) -> str:
    return " ".join(text.split()).casefold()


def surface_labels(survey: model.Survey, room_id: str) -> list[str]:
    """The location labels of the room's surface readings over every visit, each once."""
    labels: dict[str, str] = {}
    for visit in survey.visits:
        room_visit = visit.room_visit(room_id)
        for reading in room_visit.surfaces if room_visit else ():
            labels.setdefault(_fold(reading.location), reading.location)
    return list(labels.values())


def resolve_surface(survey: model.Survey, room_id: str, label: str) -> str:
    """The surface label as recorded in the room (matched ignoring case and repeated spaces);
    :class:`InputError` ("surface") listing the room's surfaces when there is none such."""
    known = surface_labels(survey, room_id)
    for recorded in known:
        if _fold(recorded) == _fold(label):
            return recorded
    listed = count_cut([f"'{k}'" for k in known]) or "none recorded yet"
    raise InputError(
        "surface",
        label,
        f"no surface reading with this location in the room; its surfaces: {listed}",
    )


def _readings(
    survey: model.Survey, room_id: str, label: str
) -> list[tuple[int, int, model.SurfaceReading]]:
    """(visit index, position in the room visit, reading) of every reading at ``label``."""
    found = []
    for v, visit in enumerate(survey.visits):
        room_visit = visit.room_visit(room_id)
        for s, reading in enumerate(room_visit.surfaces if room_visit else ()):
            if _fold(reading.location) == _fold(label):
                found.append((v, s, reading))
    return found


def _material_and_element(survey: model.Survey, room_id: str, label: str) -> tuple[str, str]:
    readings = _readings(survey, room_id, label)
    material = next((r.material for _, _, r in reversed(readings) if r.material.strip()), "")
    element = readings[-1][2].element if readings else "other"
    return material, element


def measured_factor(
    survey: model.Survey, room_id: str, label: str, near: dt.datetime
) -> tuple[float, int] | None:
    """The surface's temperature factor from the visit nearest ``near`` on which it could be
    judged (the assessment's own, so the inside-outside difference was large enough), with
    that visit's index; None when no visit gives one."""
    best: tuple[float, float, int] | None = None
    for v, s, _ in _readings(survey, room_id, label):
        assessed = evaluate.assess_visit(survey, v)
        if room_id not in assessed.room_ids:
            continue
        finding = assessed.findings.rooms[assessed.room_ids.index(room_id)]
        factor = finding.surfaces[s].temperature_factor if s < len(finding.surfaces) else None
        if factor is None:
            continue
        try:
            distance = abs((survey.visits[v].started_at - near) / _HOUR)
        except TypeError:  # naive and aware times: any visit will do
            distance = float(v)
        if best is None or distance < best[0]:
            best = (distance, factor, v)
    return None if best is None else (best[1], best[2])


def _outdoor_samples(survey: model.Survey) -> tuple[list[model.LogSample], tuple[str, ...]]:
    logs = [log for log in survey.logs if log.room is None and log.samples]
    by_time = {sample.at: sample for log in logs for sample in log.samples}
    try:
        samples = [by_time[t] for t in sorted(by_time)]
    except TypeError:  # naive and aware times across outdoor series
        samples = list(logs[0].samples) if logs else []
    return samples, tuple(log.source for log in logs)


def air_to_surface(
    air: list[model.LogSample], outdoor: list[model.LogSample], frsi: float
) -> tuple[SurfaceSeries, int]:
    """The surface series from room-air samples, outdoor samples (in time order) and the
    temperature factor (see the module notes), and how many room samples were left out."""
    if not outdoor:
        return SurfaceSeries([], [], [], [], "air_and_factor"), len(air)
    if (air[0].at.tzinfo is None) != (outdoor[0].at.tzinfo is None):
        raise InputError(
            "outdoor series",
            "(times)",
            "the outdoor and room loggers' times differ in carrying a UTC offset, so they "
            "cannot be lined up",
        )
    reach = th.value("mould_index_gap_h")
    ref = air[0].at
    out_h = [(s.at - ref) / _HOUR for s in outdoor]
    out_t = [s.dry_bulb_c for s in outdoor]
    times: list[dt.datetime] = []
    temps: list[float] = []
    rhs: list[float] = []
    capped = left_out = 0
    p = 0
    last = len(out_h) - 1
    water = psychro.sat_vapour_pressure_water_pa
    for sample in air:
        h = (sample.at - ref) / _HOUR
        while p < last and out_h[p + 1] <= h:
            p += 1
        if h < out_h[0] or h > out_h[last]:
            left_out += 1
            continue
        if out_h[p] == h or p == last:
            theta_e = out_t[p]
        else:
            span = out_h[p + 1] - out_h[p]
            if span > 2 * reach:
                left_out += 1
                continue
            theta_e = out_t[p] + (out_t[p + 1] - out_t[p]) * (h - out_h[p]) / span
        theta_i = sample.dry_bulb_c
        theta_s = theta_e + frsi * (theta_i - theta_e)
        rh = sample.rh_pct * water(theta_i) / water(theta_s)
        if rh > 100.0:
            rh = 100.0
            capped += 1
        times.append(sample.at)
        temps.append(theta_s)
        rhs.append(rh)
    return SurfaceSeries.from_samples(times, temps, rhs, "air_and_factor", capped), left_out


def room_series(survey: model.Survey, room_id: str, series: str | None = None) -> list[int]:
    """Indexes in ``survey.logs`` of the room's series; ``series`` picks one, by its number
    among the room's series (1 is the first) or its source file's name. :class:`InputError`
    ("series") when it names none, ("room") when the room has no series."""
    mine = [i for i, log in enumerate(survey.logs) if log.room == room_id]
    if not mine:
        raise InputError("room", room_id, "no logger series was imported for this room")
    if series is None:
        return mine
    text = series.strip()
    if text.isdigit() and 1 <= int(text) <= len(mine):
        return [mine[int(text) - 1]]
    named = [i for i in mine if survey.logs[i].source == text]
    if named:
        return named
    listed = count_cut([f"{n} ({survey.logs[i].source})" for n, i in enumerate(mine, 1)])
    raise InputError("series", series, f"the room's logger series are: {listed}")


def _in_time_order(log: model.LogSeries) -> list[model.LogSample] | None:
    """The series' samples in time order (a hand-edited file may not keep it); None when its
    times mix those with and without a UTC offset, which cannot be ordered."""
    try:
        return sorted(log.samples, key=lambda s: s.at)
    except TypeError:
        return None


def _span_middle(samples: list[model.LogSample]) -> dt.datetime:
    return samples[0].at + (samples[-1].at - samples[0].at) / 2


def judge_log(
    survey: model.Survey, log_index: int, surface: str | None = None, stated: str | None = None
) -> LogIndex | LogNotJudged:
    """The index over ``survey.logs[log_index]`` (a room's series). A surface logger is used
    as it is (``surface``, if given, must be its surface); an air logger needs ``surface``
    with a measured temperature factor and an outdoor logger, else :class:`LogNotJudged`."""
    log = survey.logs[log_index]
    room_id = log.room or ""
    samples = _in_time_order(log)
    if samples is None:
        return LogNotJudged(log_index, log.source, room_id, "times_mixed")
    label = log.surface if log.surface is not None else surface
    material, element = _material_and_element(survey, room_id, label) if label else ("", "other")
    choice = choose_class(material, label or "", element, stated)
    if len(samples) < 2:
        return LogNotJudged(log_index, log.source, room_id, "too_few")
    if log.surface is not None:
        series = SurfaceSeries.from_samples(
            [s.at for s in samples], [s.dry_bulb_c for s in samples], [s.rh_pct for s in samples]
        )
        source = SeriesSource(log_index, log.source, room_id, log.surface, material, element)
        return LogIndex(source, analyse(series, choice))
    if label is None:
        raise InputError(
            "surface",
            "(not given)",
            "this logger measured the room's air: name the surface to judge (a surface "
            "reading's location with a measured temperature factor); the room's surfaces: "
            + (count_cut([f"'{k}'" for k in surface_labels(survey, room_id)]) or "none"),
        )
    found = measured_factor(survey, room_id, label, _span_middle(samples))
    if found is None:
        return LogNotJudged(log_index, log.source, room_id, "no_factor")
    frsi, visit = found
    outdoor, outdoor_sources = _outdoor_samples(survey)
    if not outdoor:
        return LogNotJudged(log_index, log.source, room_id, "no_outdoor")
    try:
        series, left_out = air_to_surface(samples, outdoor, frsi)
    except InputError:
        return LogNotJudged(log_index, log.source, room_id, "times_mixed")
    if len(series.times) < 2:
        return LogNotJudged(log_index, log.source, room_id, "outdoor_gap")
    source = SeriesSource(
        log_index,
        log.source,
        room_id,
        label,
        material,
        element,
        frsi,
        visit + 1,
        outdoor_sources,
        left_out,
    )
    return LogIndex(source, analyse(series, choice))


def _lowest_factor_surface(survey: model.Survey, log: model.LogSeries) -> str | None:
    room_id = log.room or ""
    near = _span_middle(_in_time_order(log) or log.samples)
    found = [
        (factor[0], label)
        for label in surface_labels(survey, room_id)
        if (factor := measured_factor(survey, room_id, label, near)) is not None
    ]
    return min(found)[1] if found else None


def judge_room(
    survey: model.Survey,
    room_key: str,
    surface: str | None = None,
    series: str | None = None,
    stated: str | None = None,
) -> list[LogIndex | LogNotJudged]:
    """The index for a room's series (the command's question). With ``surface``: the
    room's loggers on that surface, else its air loggers through the surface's temperature
    factor. Without: the room's surface loggers. :class:`InputError` when nothing fits."""
    room = survey.find_room(room_key)
    if room is None:
        known = count_cut([f"{r.id} ({r.name})" for r in survey.rooms]) or "none yet"
        raise InputError("room", room_key, f"no such room in the survey; rooms: {known}")
    room_id = room.id
    picked = room_series(survey, room_id, series)
    if surface is not None:
        label = resolve_surface(survey, room_id, surface)
        on_it = [i for i in picked if _fold(survey.logs[i].surface or "") == _fold(label)]
        air = [i for i in picked if survey.logs[i].surface is None]
        chosen = on_it or air
        if not chosen:
            raise InputError(
                "surface",
                surface,
                "the room's logger series sat on other surfaces: "
                + count_cut([f"'{survey.logs[i].surface}'" for i in picked]),
            )
        return [judge_log(survey, i, label, stated) for i in chosen]
    on_surfaces = [i for i in picked if survey.logs[i].surface is not None]
    if not on_surfaces:
        return [judge_log(survey, picked[0], None, stated)]  # raises: it needs a surface
    return [judge_log(survey, i, None, stated) for i in on_surfaces]


def judge_survey(survey: model.Survey) -> list[LogIndex | LogNotJudged]:
    """Every room series of the survey judged for the report: a surface logger as it is, an
    air logger through the room's surface with the lowest measured temperature factor (the
    coldest for its weather, the first to grow mould)."""
    judged: list[LogIndex | LogNotJudged] = []
    for i, log in enumerate(survey.logs):
        if log.room is None:
            continue
        if log.surface is not None or len(log.samples) < 2 or _in_time_order(log) is None:
            judged.append(judge_log(survey, i))
            continue
        label = _lowest_factor_surface(survey, log)
        if label is None:
            judged.append(LogNotJudged(i, log.source, log.room, "no_factor"))
        else:
            judged.append(judge_log(survey, i, label))
    return judged
