"""``survey mould-index``: the mould-growth index over a room's logger series.

    survey mould-index flat9.json --room bed1                       # the room's surface loggers
    survey mould-index flat9.json --room bed1 --surface "NE corner" # or an air logger + fRsi
    survey mould-index flat9.json --room bed1 --series 2 --class very_sensitive --json

The work is :mod:`survey.mould_series` and :mod:`survey.mould_index`; every sentence comes from
:mod:`survey.words.mould_index`. Text from the survey (names, labels, file names) is printed
with control characters made visible. Errors are one line: a bad option exits 2, a survey file
that cannot be read exits 1.
"""

from __future__ import annotations

import argparse
import functools
import json
from collections.abc import Callable
from typing import TYPE_CHECKING, Any

from survey.errors import InputError

if TYPE_CHECKING:
    from survey.mould_index import MouldIndexResult
    from survey.mould_series import LogIndex, LogNotJudged

#: The sensitivity classes (``survey.mould_index.CLASS_KEYS``; a test holds them equal),
#: written out so that registering the command imports nothing.
CLASS_CHOICES = ("very_sensitive", "sensitive", "medium_resistant", "resistant")
#: Points of the index over time in ``--json`` (each the highest of its stretch).
JSON_POINTS = 400

_OPTIONS = {
    "room": "--room",
    "surface": "--surface",
    "series": "--series",
    "sensitivity class": "--class",
    "outdoor series": "--series",
}


def register(subparsers: argparse._SubParsersAction) -> None:
    parser = subparsers.add_parser(
        "mould-index",
        help="the mould-growth index over a room's logger series",
        description="Run a room's logged temperature and RH through the published "
        "mould-growth index model (Hukka and Viitanen, with the material classes of "
        "Ojanen, Viitanen and co-workers): the highest index and what it means, the days "
        "above index 1 and 3, the periods that favoured growth, and ASHRAE 160-2009's "
        "30-day criterion on the same series. A logger on a surface is used as it is; a "
        "logger in the room's air needs --surface, a surface with a measured temperature "
        "factor, and an outdoor logger series.",
    )
    parser.add_argument("file", metavar="FILE", help="the survey file (.json)")
    parser.add_argument("--room", required=True, metavar="ID", help="room id or name")
    parser.add_argument(
        "--surface",
        metavar="LABEL",
        help="the surface's location label: its logger, or for an air logger the surface "
        "whose temperature factor turns the room air into surface conditions",
    )
    parser.add_argument(
        "--series",
        metavar="N|SOURCE",
        help="one of the room's logger series: its number (1 is the first) or its file name",
    )
    parser.add_argument(
        "--class",
        dest="sensitivity",
        choices=CLASS_CHOICES,
        default=None,
        help="the material's mould sensitivity class (default: from the surface's material "
        "and label, else sensitive)",
    )
    parser.add_argument("--units", choices=("si", "ip"), default=None, help="units of the text")
    parser.add_argument("--json", action="store_true", help="print one JSON object for tools")
    parser.set_defaults(handler=run_mould_index)


def _relabel(handler: Callable[[argparse.Namespace], int]) -> Callable[..., int]:
    @functools.wraps(handler)
    def run(args: argparse.Namespace) -> int:
        from survey.safe_text import shorten, visible

        try:
            return handler(args)
        except InputError as exc:
            field = _OPTIONS.get(exc.field, exc.field)
            raise InputError(
                visible(field), shorten(exc.value, 120), shorten(exc.allowed, 400)
            ) from None

    return run


def _time(at: Any) -> str | None:
    return None if at is None else at.isoformat()


def result_json(result: MouldIndexResult) -> dict[str, Any]:
    """The typed result as JSON-ready values with SI keys (the encoding at the edge)."""
    a = result.ashrae160
    return {
        "basis": result.basis,
        "sensitivity_class": result.choice.key,
        "class_basis": result.choice.basis,
        "class_word": result.choice.word,
        "start": _time(result.start),
        "end": _time(result.end),
        "samples": result.samples,
        "logged_days": round(result.logged_days, 3),
        "index_max": round(result.index_max, 4),
        "index_max_at": _time(result.index_max_at),
        "index_final": round(result.index_final, 4),
        "index_state": result.state.value,
        "rising_at_end": result.rising_at_end,
        "days_above_1": round(result.days_above_1, 3),
        "days_above_3": round(result.days_above_3, 3),
        "first_above_1_at": _time(result.first_above_1_at),
        "first_above_3_at": _time(result.first_above_3_at),
        "favourable_h": round(result.favourable_h, 2),
        "favourable_periods": [
            {
                "start": _time(p.start),
                "end": _time(p.end),
                "favourable_h": round(p.favourable_h, 2),
                "index_max": round(p.index_max, 4),
            }
            for p in result.periods
        ],
        "gaps": result.gaps,
        "gap_h": round(result.gap_h, 2),
        "surface_rh_capped": result.capped,
        "ashrae160": {
            "state": a.state.value,
            "days_exceeded": round(a.days_exceeded, 3),
            "first_exceeded_at": _time(a.first_exceeded_at),
            "highest_mean_rh_pct": None
            if a.highest_mean_rh_pct is None
            else round(a.highest_mean_rh_pct, 2),
            "highest_at": _time(a.highest_at),
            "whole_mean_rh_pct": round(a.whole_mean_rh_pct, 2),
            "whole_mean_temp_c": round(a.whole_mean_temp_c, 2),
        },
        "index_series": [
            [_time(p.at), round(p.value, 4)] for p in result.index.points(JSON_POINTS)
        ],
        "threshold_keys": [*result.threshold_keys, *a.threshold_keys],
    }


def _series_json(judged: LogIndex | LogNotJudged) -> dict[str, Any]:
    from survey.mould_series import LogNotJudged

    if isinstance(judged, LogNotJudged):
        return {"source": judged.source, "judged": False, "reason": judged.reason}
    source = judged.source
    return {
        "source": source.source,
        "judged": True,
        "surface": source.surface,
        "material": source.material,
        "frsi": None if source.frsi is None else round(source.frsi, 4),
        "frsi_visit": source.frsi_visit,
        "outdoor_sources": list(source.outdoor_sources),
        "left_out": source.left_out,
        **result_json(judged.result),
    }


@_relabel
def run_mould_index(args: argparse.Namespace) -> int:
    from survey import mould_series, store
    from survey.safe_text import visible
    from survey.words import Display
    from survey.words import mould_index as mw

    survey = store.load_survey(args.file)
    judged = mould_series.judge_room(
        survey, args.room, surface=args.surface, series=args.series, stated=args.sensitivity
    )
    room = survey.find_room(args.room)
    room_id = room.id if room is not None else args.room
    if args.json:
        payload = {"room": room_id, "series": [_series_json(j) for j in judged]}
        print(json.dumps(payload, ensure_ascii=False, indent=2))
        return 0
    d = Display(args.units or survey.site.unit_system)
    name = room.name if room is not None else args.room
    for number, one in enumerate(judged):
        if number:
            print()
        print(visible(mw.series_title(one, name)))
        for line in mw.summary_lines(one, d):
            print(f"  {visible(line)}")
    print()
    print(mw.LIMITS)
    return 0
