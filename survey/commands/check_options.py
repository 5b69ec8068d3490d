"""``survey check``'s options: what each is, in the help a user reads."""

from __future__ import annotations

import argparse

from survey import thresholds as th
from survey import units
from survey.commands.check_parse import _SurfaceOption

DESCRIPTION = (
    "Dew point, surface condensation, mould risk and what to do, for one room. A bare number "
    "is read in the chosen unit system (°C/hPa/m/m³ for si, °F/inHg/ft/ft³ for ip); a unit "
    "may be typed with any value: 70F, 21 °C, 1002hPa, 1150 ft, 30 m3. Say what each measured "
    "surface is: --surface-temp is a wall, ceiling or floor (not said which); --glazing-temp, "
    "--frame-temp and --pipe-temp are judged for condensation only and never set the room's "
    "RH target; --surface ELEMENT:TEMP[:LABEL] names any element. Instrument accuracies "
    "default to typical specifications (air "
    f"±{th.value('accuracy_air_temp_k'):g} K, RH ±{th.value('accuracy_rh_pct'):g} %, surface "
    f"±{th.value('accuracy_surface_temp_k'):g} K); the output says which were used."
)


def add_arguments(parser: argparse.ArgumentParser) -> None:
    """Every option of ``survey check``, in the order of its help."""
    parser.add_argument(
        "--air-temp", required=True, metavar="T", help="room air (dry-bulb) temperature"
    )
    parser.add_argument(
        "--rh",
        required=True,
        metavar="RH",
        help="room relative humidity, %% (relative to water, as hygrometers read)",
    )
    surfaces = parser.add_argument_group(
        "surfaces (each option may be repeated; the order typed is kept)"
    )
    surfaces.add_argument(
        "--surface-temp",
        action=_SurfaceOption,
        dest="surfaces",
        default=[],
        metavar="T",
        help="a wall, ceiling or floor surface temperature (which one not "
        "said: judged as part of the heated envelope)",
    )
    surfaces.add_argument(
        "--glazing-temp",
        action=_SurfaceOption,
        dest="surfaces",
        metavar="T",
        help="a window pane: condensation only",
    )
    surfaces.add_argument(
        "--frame-temp",
        action=_SurfaceOption,
        dest="surfaces",
        metavar="T",
        help="a window frame: condensation, and mould on frames and seals",
    )
    surfaces.add_argument(
        "--pipe-temp",
        action=_SurfaceOption,
        dest="surfaces",
        metavar="T",
        help="a cold pipe: condensation only",
    )
    surfaces.add_argument(
        "--surface",
        action=_SurfaceOption,
        dest="surfaces",
        metavar="ELEMENT:T[:LABEL]",
        help="any surface, e.g. external_wall:11.2:NE corner; ELEMENT is "
        "one of " + ", ".join(th.SURFACE_ELEMENTS),
    )
    parser.add_argument("--outdoor-temp", metavar="T", help="outdoor air temperature")
    parser.add_argument("--outdoor-rh", metavar="RH", help="outdoor relative humidity, %%")
    where = parser.add_mutually_exclusive_group()
    where.add_argument(
        "--altitude", metavar="Z", help="site altitude (standard atmosphere gives the pressure)"
    )
    where.add_argument("--pressure", metavar="P", help="measured barometric pressure")
    room = parser.add_argument_group("room (for the advice)")
    room.add_argument(
        "--use",
        type=str.lower,
        choices=th.ROOM_USES,
        metavar="USE",
        help="room use, which sets the temperature-factor limit: "
        + ", ".join(th.ROOM_USES)
        + " (default: not given, general limit)",
    )
    room.add_argument(
        "--room-volume",
        metavar="V",
        help="room volume (m³ for si, ft³ for ip), or its dimensions such as 4.2x3.1x2.4, "
        "to size airflow and drying",
    )
    room.add_argument(
        "--occupants", metavar="N", help="people usually in the room, for the moisture load"
    )
    room.add_argument(
        "--target-rh",
        metavar="RH",
        help=f"room RH to aim for, %% (default "
        f"{th.value('room_rh_target_default_pct'):g}, lowered when the "
        f"coldest wall, ceiling or floor needs it)",
    )
    room.add_argument(
        "--mould-seen",
        action="store_true",
        help="visible mould in the room (for the mould caution)",
    )
    room.add_argument(
        "--mould-area",
        metavar="AREA",
        help="area of visible mould, m² for si, ft² for ip, or with m2 / ft2 "
        "(implies --mould-seen); sets the small / medium / large guidance",
    )
    use = parser.add_argument_group(
        "the room's use (for its moisture load; a bathroom, kitchen "
        "or utility room with none given gets its typical use)"
    )
    use.add_argument("--showers-per-day", metavar="N", help="showers taken a day")
    use.add_argument("--baths-per-day", metavar="N", help="baths taken a day")
    use.add_argument("--cooking-hours", metavar="H", help="hours of cooking a day")
    use.add_argument("--laundry-loads", metavar="N", help="wash loads dried indoors a day")
    water = parser.add_argument_group("water damage and combustion air")
    water.add_argument(
        "--water-category",
        type=int,
        choices=(1, 2, 3),
        metavar="1|2|3",
        help="category of the water that got in: 1 clean, 2 significantly "
        "contaminated, 3 grossly contaminated (sewage, flood)",
    )
    water.add_argument(
        "--water-standing-hours",
        metavar="H",
        help="how long the water has stood (clean water degrades to category "
        "2, and category 2 to 3)",
    )
    water.add_argument(
        "--water-loss-class",
        type=int,
        choices=(1, 2, 3, 4),
        metavar="1-4",
        help="class of water loss, 1 (least evaporation load) to 4 (bound "
        "water in dense materials); sets the drying load",
    )
    water.add_argument(
        "--wet-area-pct",
        metavar="PCT",
        help="share of the room's floor, wall and ceiling area that is wet, "
        "for the class of water loss",
    )
    water.add_argument(
        "--dense-materials-wet",
        action="store_true",
        help="hardwood, plaster, concrete or masonry holds water (class 4)",
    )
    water.add_argument(
        "--drying",
        action="store_true",
        help="drying equipment is running in the room (it is kept closed and dehumidified)",
    )
    water.add_argument(
        "--flued-appliance",
        type=str.lower,
        choices=("yes", "no"),
        metavar="yes|no",
        help="an open-flued boiler, water heater, stove or fire in the room or "
        "the building (not said: the combustion-air caution is shown "
        "wherever the advice closes the space up or extracts air)",
    )
    month = parser.add_argument_group(
        "the colder month (each surface's measured temperature factor and the room's "
        "moisture excess carried to a design month, EN ISO 13788)"
    )
    month.add_argument(
        "--design-outdoor-temp",
        metavar="T",
        help="mean outdoor temperature of the month to project to, e.g. 0 (with "
        "--design-outdoor-rh; needs --outdoor-temp and --outdoor-rh today)",
    )
    month.add_argument(
        "--design-outdoor-rh", metavar="RH", help="mean outdoor RH of that month, %%"
    )
    month.add_argument(
        "--design-indoor-temp",
        metavar="T",
        help="room temperature held in that month (default: as measured, --air-temp)",
    )
    month.add_argument(
        "--design-excess",
        type=str.lower,
        choices=("class-line", "measured"),
        default="class-line",
        metavar="class-line|measured",
        help="the room's vapour-pressure excess in that month: carried along its "
        "humidity class's line (constant at and below "
        f"{th.value('humidity_class_flat_below_c'):g} °C outside, zero at "
        f"{th.value('humidity_class_zero_at_c'):g} °C; the default, used when today's outdoor "
        f"air is at most {th.value('class_line_warmest_outdoor_c'):g} °C, held as measured "
        "on a warmer day) or held as measured",
    )
    accuracy = parser.add_argument_group("instrument accuracy (± each)")
    accuracy.add_argument(
        "--air-temp-accuracy",
        metavar="K",
        help="air thermometer, K for si, °F for ip (default "
        f"{th.value('accuracy_air_temp_k'):g} K); also used outdoors",
    )
    accuracy.add_argument(
        "--rh-accuracy",
        metavar="RH",
        help=f"hygrometer, %%RH (default {th.value('accuracy_rh_pct'):g}); also used outdoors",
    )
    accuracy.add_argument(
        "--surface-temp-accuracy",
        metavar="K",
        help="surface thermometer, K for si, °F for ip (default "
        f"{th.value('accuracy_surface_temp_k'):g} K)",
    )
    accuracy.add_argument(
        "--outdoor-thermometer",
        type=str.lower,
        choices=("same", "separate"),
        default="same",
        metavar="same|separate",
        help="whether the room thermometer also read the outdoor air (the "
        "usual case, and the default: the two readings' errors are "
        "correlated in the temperature factor, GUM 5.2)",
    )
    parser.add_argument(
        "--units",
        type=str.lower,
        choices=units.UNIT_SYSTEMS,
        default="si",
        help="unit system for bare numbers and for the table (default si)",
    )
    parser.add_argument(
        "--json", action="store_true", help="print one JSON object with SI keys instead of a table"
    )
