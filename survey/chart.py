"""The data of the charts: a visit's psychrometric chart, and a generic time-series chart.

Nothing here draws. The report's SVG (:mod:`survey.report.svg`) and the app's chart screen
(:mod:`survey.app.chart`) lay out what these records hold, so both show the same points.

Psychrometric chart (:func:`psychro_chart`): humidity ratio against dry bulb at the site's
pressure, every state from :mod:`survey.psychro`:

* the saturation curve (100 % RH over liquid water, the hygrometers' convention) and the
  80 % RH line (the surface-RH mould limit, :mod:`survey.thresholds` key
  ``surface_rh_mould_limit_pct``), with faint 20, 40 and 60 % RH lines to read RH by; below
  the triple point also the frost curve (saturation over ice), since a surface below 0 °C
  is judged against ice;
* each room's air (dry bulb, humidity ratio, RH, dew point, its name and the words of its
  worst surface) and the outdoor air;
* each room's coldest measured surface, on the saturation curve at its temperature (over
  ice below the triple point): the room's air condenses on it when the room's point lies
  at or above that height, i.e. when the surface is at or below the room's dew point.

The dry-bulb range covers every point and surface with at least :data:`MARGIN_K` to spare,
its ends on whole 5 °C (or 10 °F). Every record holds SI numbers; :meth:`PsychroChart.x` and
:meth:`PsychroChart.y` give them in the chart's display units (°C and g/kg, or °F and
grains per pound: 7000 grains make a pound), and the axes carry their ticks already in
those units, so no drawing code converts anything.

Time series (:func:`time_series_chart`): x is a datetime, one or more named series share
one y axis with its unit, and optional horizontal guides (a limit, a goal). Used for the
small charts of drying progress and the mould-growth index.
"""

from __future__ import annotations

import datetime as dt
import math
from collections.abc import Iterable, Sequence
from dataclasses import dataclass
from typing import TYPE_CHECKING, NamedTuple

from survey import psychro, units
from survey import thresholds as th
from survey.assess import CondensationState
from survey.words.charts import CHART_LABELS

if TYPE_CHECKING:
    from survey.evaluate import VisitAssessment

#: At least this much dry-bulb range beyond the coldest and warmest point, K.
MARGIN_K = 3.0
#: The dry-bulb range's ends are multiples of this, in the display unit (°C, °F).
RANGE_STEP = {"si": 5.0, "ip": 10.0}
#: The narrowest dry-bulb range shown, K.
MIN_SPAN_K = 20.0
#: Dry-bulb step between the computed points of each curve, K.
CURVE_STEP_K = 0.5
#: How many parts of the worst surface's verdict a point carries (what forms; mould).
VERDICT_PARTS = 2
#: Faint RH lines drawn to read a point's RH by, %.
GUIDE_RH_PCT = (20.0, 40.0, 60.0)

#: The chart's labels (the words module's).
LABELS = CHART_LABELS


class ChartXY(NamedTuple):
    """One point of a curve, SI."""

    dry_bulb_c: float
    humidity_ratio_kg_per_kg: float


@dataclass(frozen=True, slots=True)
class ChartLine:
    """A curve of constant RH (or saturation over ice) across the chart's range."""

    key: str  #: "saturation", "mould_limit", "frost" or "guide"
    label: str
    rh_pct: float | None  #: relative to liquid water; None for the frost curve
    points: tuple[ChartXY, ...]


@dataclass(frozen=True, slots=True)
class SurfacePoint:
    """A room's coldest measured surface, placed on the saturation curve at its own
    temperature (over ice below the triple point): where the room's air would condense."""

    label: str
    surface_temp_c: float
    humidity_ratio_kg_per_kg: float  #: saturation at the surface temperature
    condensing: bool  #: the assessment finds water or frost forming on it (state condensing)


@dataclass(frozen=True, slots=True)
class AirPoint:
    """A room's air, or the outdoor air, on the chart."""

    mark: str  #: the short label drawn beside the point: "1", "2", … or "out"
    name: str  #: the room's name as typed (user text), or "Outdoors"
    outdoor: bool
    dry_bulb_c: float
    humidity_ratio_kg_per_kg: float
    rh_pct: float
    dew_point_c: float  #: over liquid water
    condensation_point_c: float  #: dew point, or frost point below 0.01 °C
    worst_words: str  #: the verdict on :func:`survey.words.worst_surface` ("" outdoors)
    condensing: bool  #: the assessment finds water or frost forming on one of its surfaces
    coldest: SurfacePoint | None


@dataclass(frozen=True, slots=True)
class Axis:
    """One axis in display units: its label, unit, range and ticks."""

    label: str
    unit: str
    low: float
    high: float
    ticks: tuple[float, ...]

    def fraction(self, value: float) -> float:
        """Where ``value`` (display units) lies along the axis, 0 at ``low``, 1 at ``high``."""
        return (value - self.low) / (self.high - self.low)


@dataclass(frozen=True, slots=True)
class PsychroChart:
    """A visit's psychrometric chart: curves, points and axes (see the module notes)."""

    system: str  #: "si" or "ip"
    pressure_pa: float
    dry_bulb_low_c: float
    dry_bulb_high_c: float
    lines: tuple[ChartLine, ...]
    rooms: tuple[AirPoint, ...]
    outdoor: AirPoint | None
    x_axis: Axis
    y_axis: Axis

    def x(self, dry_bulb_c: float) -> float:
        """A dry bulb (°C) in the chart's display unit."""
        return units.to_display("temperature", dry_bulb_c, _system(self.system))

    def y(self, humidity_ratio_kg_per_kg: float) -> float:
        """A humidity ratio (kg/kg) in the chart's display unit (g/kg or gr/lb)."""
        return units.to_display("humidity_ratio", humidity_ratio_kg_per_kg, _system(self.system))

    @property
    def points(self) -> tuple[AirPoint, ...]:
        """The outdoor air first (when read), then the rooms."""
        return ((self.outdoor,) if self.outdoor is not None else ()) + self.rooms

    def line(self, key: str) -> ChartLine:
        return next(line for line in self.lines if line.key == key)


def _system(system: str) -> units.UnitSystem:
    if system == "ip":
        return "ip"
    if system == "si":
        return "si"
    raise ValueError(f"unit system {system!r}: expected 'si' or 'ip'")


def nice_ticks(low: float, high: float, count: int = 6) -> tuple[float, ...]:
    """Round tick values (1, 2 or 5 × 10ⁿ apart) from ``low`` to ``high``, about ``count``."""
    if not high > low:
        return (low,)
    raw = (high - low) / max(count, 1)
    power = 10.0 ** math.floor(math.log10(raw))
    step = min(
        (m * power for m in (1.0, 2.0, 5.0, 10.0)),
        key=lambda s: abs((high - low) / s - count),
    )
    first = math.ceil(low / step - 1e-9) * step
    ticks = []
    value = first
    while value <= high + step * 1e-9:
        ticks.append(round(value, 10) + 0.0)
        value += step
    return tuple(ticks)


def _humidity_ratio_at(dry_bulb_c: float, rh_pct: float, pressure_pa: float) -> float:
    """psychro's light state (no wet-bulb solve): the humidity ratio of state_from_rh."""
    return psychro.vapour_state(dry_bulb_c, rh_pct, pressure_pa).humidity_ratio_kg_per_kg


def saturation_over_ice_rh_pct(temp_c: float) -> float:
    """Saturation over ice written as RH relative to liquid water (below the triple point),
    so :func:`survey.psychro.state_from_rh` gives the frost-saturated state."""
    return (
        100.0
        * psychro.sat_vapour_pressure_pa(temp_c)
        / psychro.sat_vapour_pressure_water_pa(temp_c)
    )


def saturation_humidity_ratio(temp_c: float, pressure_pa: float) -> float:
    """Humidity ratio (kg/kg) of air saturated over the phase that forms at ``temp_c``: ice
    at and below the triple point, liquid water above (as :func:`survey.psychro.surface_rh_pct`
    judges a surface)."""
    rh = 100.0 if temp_c > psychro.TRIPLE_POINT_C else saturation_over_ice_rh_pct(temp_c)
    return _humidity_ratio_at(temp_c, min(rh, 100.0), pressure_pa)


def _curve(low_c: float, high_c: float) -> list[float]:
    """Dry bulbs from ``low_c`` to ``high_c`` (both ends included) every CURVE_STEP_K."""
    steps = math.ceil((high_c - low_c) / CURVE_STEP_K - 1e-9)
    return [low_c + i * CURVE_STEP_K for i in range(steps)] + [high_c]


def _rh_line(key: str, label: str, rh: float, temps: Sequence[float], p: float) -> ChartLine:
    return ChartLine(key, label, rh, tuple(ChartXY(t, _humidity_ratio_at(t, rh, p)) for t in temps))


def chart_lines(low_c: float, high_c: float, pressure_pa: float) -> tuple[ChartLine, ...]:
    """The saturation curve, the mould-limit line, the RH guides and (below the triple point)
    the frost curve from ``low_c`` to ``high_c`` at ``pressure_pa``."""
    temps = _curve(low_c, high_c)
    mould = th.value("surface_rh_mould_limit_pct")
    lines = [
        _rh_line("saturation", LABELS["saturation"], 100.0, temps, pressure_pa),
        _rh_line("mould_limit", LABELS["mould_limit"].format(rh=mould), mould, temps, pressure_pa),
    ]
    lines += [
        _rh_line("guide", LABELS["guide"].format(rh=rh), rh, temps, pressure_pa)
        for rh in GUIDE_RH_PCT
    ]
    cold = [t for t in temps if t <= psychro.TRIPLE_POINT_C]
    if len(cold) > 1:
        lines.append(
            ChartLine(
                "frost",
                LABELS["frost"],
                None,
                tuple(ChartXY(t, saturation_humidity_ratio(t, pressure_pa)) for t in cold),
            )
        )
    return tuple(lines)


def dry_bulb_range(temps_c: Iterable[float], system: str = "si") -> tuple[float, float]:
    """The chart's dry-bulb range (°C): every temperature with :data:`MARGIN_K` to spare,
    its ends on whole multiples of :data:`RANGE_STEP` in the display unit (5 °C, 10 °F), at
    least :data:`MIN_SPAN_K` wide, inside the psychrometric domain."""
    unit_system = _system(system)
    shown = list(temps_c) or [20.0]
    step = RANGE_STEP[unit_system]

    def shown_at(temp_c: float) -> float:
        return units.to_display("temperature", temp_c, unit_system)

    def back(value: float) -> float:
        return units.from_display("temperature", value, unit_system)

    low = math.floor(shown_at(min(shown) - MARGIN_K) / step + 1e-9) * step
    high = math.ceil(shown_at(max(shown) + MARGIN_K) / step - 1e-9) * step
    while back(high) - back(low) < MIN_SPAN_K - 1e-9:
        high += step
        if back(high) - back(low) < MIN_SPAN_K - 1e-9:
            low -= step
    low_c = max(back(low), psychro.DRY_BULB_MIN_C)
    high_c = min(back(high), psychro.DRY_BULB_MAX_C)
    return low_c, high_c


def _in_domain(temp_c: float) -> bool:
    return psychro.DRY_BULB_MIN_C <= temp_c <= psychro.DRY_BULB_MAX_C


def _air_point(
    mark: str,
    name: str,
    dry_bulb_c: float,
    rh_pct: float,
    pressure_pa: float,
    outdoor: bool = False,
    worst_words: str = "",
    condensing: bool = False,
    coldest: SurfacePoint | None = None,
) -> AirPoint:
    state = psychro.state_from_rh(dry_bulb_c, rh_pct, pressure_pa)
    return AirPoint(
        mark=mark,
        name=name,
        outdoor=outdoor,
        dry_bulb_c=state.dry_bulb_c,
        humidity_ratio_kg_per_kg=state.humidity_ratio_kg_per_kg,
        rh_pct=state.rh_pct,
        dew_point_c=state.dew_point_c,
        condensation_point_c=state.condensation_point_c,
        worst_words=worst_words,
        condensing=condensing,
        coldest=coldest,
    )


def psychro_chart(assessment: VisitAssessment, system: str = "si") -> PsychroChart:
    """The psychrometric chart of a judged visit, in display units ``system``."""
    from survey import words

    unit_system = _system(system)
    d = words.Display(unit_system)
    findings = assessment.findings
    p = findings.pressure_pa
    rooms: list[AirPoint] = []
    temps: list[float] = []
    for number, f in enumerate(findings.rooms, start=1):
        worst = words.worst_surface(f.surfaces)
        in_range = [s for s in f.surfaces if _in_domain(s.surface_temp_c)]
        cold = min(in_range, key=lambda s: s.surface_temp_c) if in_range else None
        coldest = (
            None
            if cold is None
            else SurfacePoint(
                cold.label,
                cold.surface_temp_c,
                saturation_humidity_ratio(cold.surface_temp_c, p),
                cold.condensation is CondensationState.CONDENSING,
            )
        )
        rooms.append(
            _air_point(
                str(number),
                f.name,
                f.air.dry_bulb_c,
                f.air.rh_pct,
                p,
                worst_words=(
                    LABELS["no_surface"]
                    if worst is None
                    else "; ".join(words.short_verdict(worst, d).split("; ")[:VERDICT_PARTS])
                ),
                condensing=any(s.condensation is CondensationState.CONDENSING for s in f.surfaces),
                coldest=coldest,
            )
        )
        temps.append(f.air.dry_bulb_c)
        if coldest is not None:
            temps.append(coldest.surface_temp_c)
    outdoor = None
    if findings.outdoor is not None:
        outdoor = _air_point(
            "out", LABELS["outdoors"], findings.outdoor.dry_bulb_c, findings.outdoor.rh_pct, p, True
        )
        temps.append(outdoor.dry_bulb_c)
    low, high = dry_bulb_range(temps, unit_system)
    lines = chart_lines(low, high, p)
    top = max(pt.humidity_ratio_kg_per_kg for line in lines for pt in line.points)

    def to_x(value_c: float) -> float:
        return units.to_display("temperature", value_c, unit_system)

    def to_y(value: float) -> float:
        return units.to_display("humidity_ratio", value, unit_system)

    # ends rounded, so a round trip through °F does not leave 29.999999999999 on the axis
    x_low, x_high = round(to_x(low), 9), round(to_x(high), 9)
    y_high = to_y(top)
    x_axis = Axis(
        LABELS["dry_bulb"],
        units.unit_label("temperature", unit_system),
        x_low,
        x_high,
        nice_ticks(x_low, x_high, 6),
    )
    y_axis = Axis(
        LABELS["humidity_ratio"],
        units.unit_label("humidity_ratio", unit_system),
        0.0,
        y_high,
        nice_ticks(0.0, y_high, 6),
    )
    return PsychroChart(
        system=unit_system,
        pressure_pa=p,
        dry_bulb_low_c=low,
        dry_bulb_high_c=high,
        lines=lines,
        rooms=tuple(rooms),
        outdoor=outdoor,
        x_axis=x_axis,
        y_axis=y_axis,
    )


# --- time series -----------------------------------------------------------------------------


@dataclass(frozen=True, slots=True)
class Series:
    """One named series of a time-series chart; ``values`` in the chart's display unit."""

    name: str
    times: tuple[dt.datetime, ...]
    values: tuple[float, ...]


@dataclass(frozen=True, slots=True)
class Guide:
    """A horizontal reference line (a limit, a goal), in the chart's display unit."""

    name: str
    value: float


@dataclass(frozen=True, slots=True)
class TimeSeriesChart:
    """A small chart of values over time: one y axis with its unit, one or more series."""

    title: str
    system: str
    y_label: str
    unit: str
    series: tuple[Series, ...]
    guides: tuple[Guide, ...]
    y_axis: Axis
    start: dt.datetime
    end: dt.datetime

    def x_fraction(self, at: dt.datetime) -> float:
        """Where ``at`` lies between :attr:`start` (0) and :attr:`end` (1)."""
        span = (self.end - self.start).total_seconds()
        return 0.5 if span <= 0 else (at - self.start).total_seconds() / span


def time_series_chart(
    title: str,
    series: Sequence[tuple[str, Sequence[tuple[dt.datetime, float]]]],
    *,
    quantity: str | None = None,
    unit: str = "",
    y_label: str = "",
    system: str = "si",
    guides: Sequence[tuple[str, float]] = (),
    y_low: float | None = None,
    y_high: float | None = None,
) -> TimeSeriesChart:
    """A time-series chart of ``series``: (name, [(time, value), …]) pairs.

    With ``quantity`` (a :mod:`survey.units` display quantity such as ``"temperature"`` or
    ``"humidity_ratio"``) values and guides are SI and are converted to ``system``'s display
    unit, whose label becomes the unit; without it they are shown as given, in ``unit``
    (``"%"`` for RH, ``""`` for an index). ``y_low``/``y_high`` (display units) fix the axis
    ends, e.g. 0 to 6 for the mould-growth index; by default the axis covers every value and
    guide. Times of one chart are all naive or all aware. An empty series is kept (it shows
    in the legend) but needs no point; a chart with no point at all raises ValueError."""
    unit_system = _system(system)
    shown_unit = unit if quantity is None else units.unit_label(quantity, unit_system)

    def convert(value: float) -> float:
        value = float(value)
        return value if quantity is None else units.to_display(quantity, value, unit_system)

    lines = []
    for name, points in series:
        ordered = sorted(points, key=lambda pt: pt[0])
        lines.append(
            Series(
                name,
                tuple(at for at, _ in ordered),
                tuple(convert(value) for _, value in ordered),
            )
        )
    marks = tuple(Guide(name, convert(value)) for name, value in guides)
    times = [at for line in lines for at in line.times]
    if not times:
        raise ValueError("a time-series chart needs at least one point")
    values = [v for line in lines for v in line.values] + [g.value for g in marks]
    low = min(values) if y_low is None else y_low
    high = max(values) if y_high is None else y_high
    if y_low is None and y_high is None and low == high:
        low, high = low - 1.0, high + 1.0
    elif y_high is None and high <= low:
        high = low + 1.0
    elif high <= low:
        low = high - 1.0
    ticks = nice_ticks(low, high, 5)
    if y_low is None and ticks and ticks[0] > low:
        step = ticks[1] - ticks[0] if len(ticks) > 1 else 1.0
        low = ticks[0] - step
    if y_high is None and ticks and ticks[-1] < high:
        step = ticks[1] - ticks[0] if len(ticks) > 1 else 1.0
        high = ticks[-1] + step
    axis = Axis(y_label, shown_unit, low, high, nice_ticks(low, high, 5))
    return TimeSeriesChart(
        title=title,
        system=unit_system,
        y_label=y_label,
        unit=shown_unit,
        series=tuple(lines),
        guides=marks,
        y_axis=axis,
        start=min(times),
        end=max(times),
    )
