"""The words for moisture sources, drying, humidity classes and the cautions, and the faces'
shared choices (the worst surface, the narrow RH cell); see ``test_words.py``.
"""

from __future__ import annotations

import inspect
import re

import pytest
from advice_cases import (
    FT,
    P,
    action,
    advice_for,
    caution_texts,
    drying_room,
    plain,
    reason_of,
    wet_skirting_hall,
    winter_bedroom,
)
from CoolProp.HumidAirProp import HAPropsSI

from survey import advise, assess, psychro, words
from survey.advise import ActionKind, Caution
from survey.advise import cautions as caution_rules
from survey.assess import (
    Activity,
    Observations,
    OutdoorInput,
    RoomInput,
    SurfaceInput,
)

# --- sources, drying, humidity class -----------------------------------------------------------


def test_find_source_names_the_wet_reading_and_the_rot_risk():
    """The source text names the wet reading, its goal and the rot risk.

    The source text names the reading against its dry standard with the goal (11 × 1.1 =
    12.1, common practice) and asks for a rot check above 20 % MC (Wood Handbook ch. 14 [R,
    secondary])."""
    text = reason_of(wet_skirting_hall(), OutdoorInput(4.0, 85.0), ActionKind.FIND_SOURCE)
    assert text.startswith(
        "Find and deal with the source of moisture before drying or "
        "decorating: material readings above the dry standard (skirting "
        "28 against 11 (dry once at or below 12.1)); once the source is "
        "dealt with, dry them until the readings reach the dry standard;"
    )
    assert (
        "timber at or above the 20 % moisture content at which decay fungi grow "
        "(skirting 28 %): have it checked for rot"
    ) in text


def test_condensation_seen_but_not_explained_is_said():
    """Condensation seen on clear surfaces is said, with where else it may come from."""
    room = RoomInput(
        "Bedroom",
        "bedroom",
        21.0,
        45.0,
        (SurfaceInput("wall", 19.0),),
        observations=Observations(condensation_seen=True),
    )
    assert reason_of(room, None, ActionKind.FIND_SOURCE) == (
        "Find and deal with the source of moisture before drying or decorating: condensation "
        "was seen, but the measured surfaces are clear of the dew point: it may come from "
        "moments of higher humidity (cooking, drying laundry) or from water getting in."
    )


def test_drying_under_way_says_keep_drying():
    """While drying runs the text says to continue to the dry standard.

    While drying runs the text says to continue to the dry standard, with each reading's
    goal (10 % allowance, common practice: 22 → 24.2, 11.5 → 12.65, shown to 3 figures)."""
    text = reason_of(drying_room(), OutdoorInput(4.0, 85.0), ActionKind.KEEP_DRYING)
    assert text.startswith(
        "Continue drying until readings reach the dry standard: these "
        "readings are still above the dry standard (the same material in "
        "an unaffected area, allowing 10 %): party wall 46 against 22 (dry "
        "once at or below 24.2), skirting 16 against 11.5 (dry once at or "
        "below 12.7)"
    )


def test_use_not_given_never_says_a_room_of_this_kind():
    """The class reason for a room of unknown use uses neutral words."""
    room = RoomInput("R", "other", 20.0, 75.0, volume_m3=30.0, occupants=1)
    text = reason_of(room, OutdoorInput(0.0, 80.0), ActionKind.FIND_SOURCE)
    assert "of EN ISO 13788 — more than ordinary occupied rooms produce" in text
    assert "of this kind" not in text


def test_uncertain_humidity_class_says_it_may_be_high():
    """A class the accuracy cannot settle is said to be possibly high.

    A class band spanning 3 and 4 (ISO 13788 limits, from memory) in a bedroom, where 4 is
    high (common practice): the text says the class may be high and asks for repeat
    readings."""
    room = RoomInput("Bedroom", "bedroom", 20.0, 54.5, volume_m3=30.0, occupants=None)
    text = reason_of(room, OutdoorInput(0.0, 80.0), ActionKind.REPEAT_READINGS)
    assert text.startswith("The humidity class may be high:")
    assert (
        "class 3 or 4 of EN ISO 13788 at this instrument accuracy, and class 4 or above "
        "would be more than a bedroom should produce"
    ) in text


def test_bathroom_peak_defers_the_extract_rate_to_the_local_code():
    """A bathroom peak's extract is sized to the local code's minimum.

    A bathroom peak gets an extract fan sized to the local code's minimum (Approved
    Document F and ASHRAE 62.2, from memory), run on by a timer or humidistat, and a
    re-reading 30-60 min after use (common practice)."""
    room = RoomInput(
        "Bathroom", "bathroom", 20.0, 90.0, (SurfaceInput("wall", 16.0),), volume_m3=10.0
    )
    text = reason_of(room, OutdoorInput(0.0, 80.0), ActionKind.REPEAT_READINGS)
    assert (
        "sized to the local code's minimum extract rate (UK Approved Document F and ASHRAE "
        "62.2 set minimum extract rates; from memory, check local code), with an overrun "
        "timer or a humidistat"
    ) in text
    assert "Take a re-reading 30-60 min after use" in text


def test_loft_text_cuts_moisture_from_below():
    """The loft text cuts moisture from below and gives the rafter's EMC.

    Loft: cut moisture from below (hatch, extract fans), check eaves and ridge, a
    dehumidifier only if sealed, a pin meter (common practice, no source), and the rafter's
    EMC in the decay range (20 %, Wood Handbook ch. 14, secondary), decay slowed below
    10 °C."""
    room = RoomInput("Loft", "loft", 3.0, 92.0, (SurfaceInput("rafter", 2.5, "ceiling"),))
    finding, advice = advice_for(room, OutdoorInput(2.0, 90.0))
    act = action(advice, ActionKind.DRY_VENTILATED_SPACE)
    text = words.action_reason(act, finding, advice, words.SI)
    assert text.startswith(
        "The loft is at 92 % RH. A ventilated loft follows outdoor air: dry "
        "it by cutting the moisture coming up from the rooms below:"
    )
    for phrase in (
        "seal gaps around the hatch",
        "no extract fan, tumble-drier or soil vent discharges into the loft",
        "Check the eaves and ridge ventilation",
        "A dehumidifier helps only if the space is sealed",
        "Measure the timber with a pin moisture meter",
    ):
        assert phrase in text
    (rafter,) = act.numbers.timber_surfaces
    assert (
        f"Rafter at 2.5 °C and {rafter.surface_rh_pct:.0f} % surface RH would settle at "
        f"about {rafter.emc_pct:.1f} % "
        f"moisture content (Wood Handbook eqn 4-5 at the surface): in the decay range "
        f"(above about 20 %); below 10.0 °C decay is slower, not stopped"
    ) in text


def test_crawlspace_text_gives_a_ground_vapour_barrier():
    """Crawl space: a ground vapour barrier and open air bricks (common practice)."""
    room = RoomInput("Crawl", "crawlspace", 12.0, 88.0, (SurfaceInput("joist", 11.0, "floor"),))
    text = reason_of(room, OutdoorInput(10.0, 85.0), ActionKind.DRY_VENTILATED_SPACE)
    assert text.startswith(
        "The crawl space is at 88 % RH. A ventilated crawl space follows "
        "outdoor air: dry it by cutting the moisture coming in: lay a ground "
        "vapour barrier"
    )
    assert "check the air bricks or vents are open and clear" in text


def test_too_cold_for_mould_state_words():
    """A surface below 5 °C reads as too cold for mould growth now.

    A surface outside the 5-40 °C range of the mould criterion (ASHRAE Standard 160,
    secondary) reads as too cold for mould growth now."""
    room = RoomInput("Loft", "loft", 4.0, 90.0, (SurfaceInput("rafter", 2.0, "ceiling"),))
    finding = assess.assess_room(room, OutdoorInput(1.0, 90.0), P)
    assert words.mould_text(finding.surfaces[0]) == (
        "too cold for mould growth now; watch for melt-water and mould when it warms"
    )


# --- cautions ----------------------------------------------------------------------------------


def test_closing_caution_defers_to_local_codes_and_licensed_professionals():
    """The closing caution defers to local codes and licensed professionals, SI and IP."""
    for display in (words.SI, words.IP):
        text = words.caution_text(advise.CLOSING, display)
        assert text == words.CLOSING_TEXT
    assert (
        "Follow local building codes and regulations, and the advice of licensed "
        "professionals (electricians, gas engineers, mould, asbestos and structural "
        "specialists), before acting on them."
    ) in words.CLOSING_TEXT


def test_site_cautions_read_once_each():
    """The site's cautions read as different sentences: none is said twice."""
    site = assess.assess_site(
        [
            winter_bedroom(),
            RoomInput("Loft", "loft", 5.0, 80.0),
            RoomInput("Loft 2", "loft", 5.0, 80.0),
        ],
        OutdoorInput(3.0, 88.0),
        P,
    )
    texts = [words.caution_text(c, words.SI) for c in advise.advise_site(site).cautions]
    assert len(texts) == len(set(texts))
    assert texts[-1] == words.CLOSING_TEXT


#: Every caution key the advice's caution rules can give, read from their source.
_CAUTION_KEYS = sorted(set(re.findall(r'Caution\("(\w+)"', inspect.getsource(caution_rules))))


def test_caution_keys_are_found():
    """The caution keys are read from the caution rules (ten or more, closing among them)."""
    assert len(_CAUTION_KEYS) >= 10 and "closing" in _CAUTION_KEYS


@pytest.mark.parametrize("key", _CAUTION_KEYS)
def test_every_caution_key_has_words(key):
    """Every caution the advice can give has words in SI and IP."""
    caution = Caution(key, use="loft", risks=("asbestos",))
    for display in (words.SI, words.IP):
        assert words.caution_text(caution, display).strip()


@pytest.mark.parametrize(("area", "word"), [(0.5, "small"), (3.0, "medium"), (12.0, "large")])
def test_visible_mould_caution_by_area(area, word):
    """Each mould area band gets its own words; only the large one calls a firm.

    Mould areas up to 10 sq ft, to 100 sq ft and above (US EPA bands, from memory) get
    their own protection and containment advice; only the large band calls a licensed
    firm."""
    text = caution_texts(plain(visible_mould_area_m2=area))["visible_mould"]
    assert text.startswith(f"Visible mould, about {area:.2g} m²: a {word} area.")
    assert ("licensed" in text) is (word == "large")


def test_visible_mould_area_in_square_feet_in_ip():
    """IP text reads a mould area in sq ft: 3 m² = 32.3 sq ft (1 ft = 0.3048 m)."""
    text = caution_texts(plain(visible_mould_area_m2=3.0), display=words.IP)["visible_mould"]
    assert text.startswith(f"Visible mould, about {3.0 / FT**2:.3g} sq ft: a medium area.")


@pytest.mark.parametrize(
    ("display", "unit", "per_m2"), [(words.SI, "m²", 1.0), (words.IP, "sq ft", 1.0 / FT**2)]
)
def test_large_mould_area_is_written_in_plain_digits(display, unit, per_m2):
    """A large mould area is written in plain digits, not exponent notation.

    A large mould area (125 m², valid up to 100 000 m²) is written in plain digits, not in
    exponent notation, within the 2 figures shown: 125 m² = 1345.5 sq ft (1 ft = 0.3048 m)."""
    text = caution_texts(plain(visible_mould_area_m2=125.0), display=display)["visible_mould"]
    shown = re.match(rf"Visible mould, about ([0-9,.]+) {unit}: a large area\.", text)
    assert shown is not None, text
    assert float(shown.group(1).replace(",", "")) == pytest.approx(125.0 * per_m2, rel=0.05)


def test_visible_mould_without_an_area_is_treated_as_medium():
    """Mould seen but not measured is to be measured, and treated as medium meanwhile.

    Mould seen but not measured: measure it (bands 0.93 m² and 9.3 m², US EPA, from
    memory), and until then treat it as a medium area with an FFP2 / N95 respirator."""
    text = caution_texts(plain(visible_mould=True))["visible_mould"]
    assert text.startswith(
        "Visible mould, area not measured: measure it (up to about 0.93 m² "
        "is a small area, over about 9.3 m² a large one"
    )
    assert "Until it is measured, treat it as a medium area: have it removed" in text
    assert "at least an FFP2 / N95 respirator" in text


def test_contaminated_water_cautions():
    """Category 3 water needs licensed handling; electrics need RCD protection.

    Category 3 water needs licensed handling; electrics near water name residual-current
    protection (restoration standard of practice; common practice)."""
    texts = caution_texts(plain(water_category=3))
    assert "It needs trained, licensed handling" in texts["water_category_3"]
    assert "residual-current protection (RCD / GFCI)" in texts["electrics_near_water"]


def test_category_1_water_caution():
    """Category 1 water is said to degrade to category 2 in about 48 hours.

    Clean water left standing degrades to category 2 (restoration standard of practice
    [R, secondary]; about 48 h from memory)."""
    text = caution_texts(drying_room(), OutdoorInput(4.0, 85.0))["water_category_1"]
    assert "it degrades to category 2 (commonly within about 48 hours" in text


@pytest.mark.parametrize(
    ("use", "opening"),
    [
        (
            "basement",
            (
                "Basement: if the basement is unheated, poorly ventilated or flooded, "
                "treat it as a confined space."
            ),
        ),
        ("crawlspace", "Crawl space: a confined or hard-to-reach space."),
        ("loft", "Loft: a confined or hard-to-reach space."),
    ],
)
def test_confined_space_caution_conditional_only_for_basements(use, opening):
    """The confined-space words are conditional only for basements.

    Crawl spaces and lofts: always confined; a basement only if unheated, poorly
    ventilated or flooded (common practice, no source). Never go in alone."""
    text = caution_texts(RoomInput("Space", use, 15.0, 70.0, ()), OutdoorInput(5.0, 80.0))[
        "confined_space"
    ]
    assert text.startswith(opening)
    assert "Do not go in alone" in text


def test_combustion_heater_caution_gives_water_and_carbon_monoxide():
    """The unflued-heater caution gives propane's water vapour and carbon monoxide.

    The unflued-heater caution gives about 1.6 kg of water per kg of propane
    (4 × 18.015 / 44.097 = 1.63, stoichiometry [C]) and carbon monoxide."""
    text = caution_texts(winter_bedroom(), OutdoorInput(3.0, 88.0))["combustion_heaters"]
    assert (
        "burning 1 kg of propane releases about 1.6 kg of water vapour into the room, and "
        "they give off carbon monoxide"
    ) in text


def test_asbestos_and_lead_by_building_age():
    """The old-materials words name asbestos and lead paint by building age.

    A building of unknown age: asbestos (to about 2000, common practice) and lead paint
    (before 1978 in the US, from memory, other years elsewhere); one built in 1990: asbestos
    only."""
    room, out = winter_bedroom(), OutdoorInput(3.0, 88.0)
    unknown = caution_texts(room, out)["asbestos_lead"]
    assert unknown.startswith(
        "Old materials: in a building of unknown age, have suspect "
        "materials checked for asbestos (used in buildings up to about "
        "2000) and lead paint (common before 1978 in the US; the year "
        "differs by country, from the 1920s to the 1990s) before "
        "drilling"
    )
    nineties = caution_texts(room, out, year=1990)["asbestos_lead"]
    assert nineties.startswith(
        "Old materials: in a building built in 1990, have suspect "
        "materials checked for asbestos (used in buildings up to about "
        "2000) before drilling"
    )
    assert "lead paint" not in nineties


def test_moisture_basis_lists_each_source_in_si():
    """The moisture basis lists the room's use, occupants and activities in SI.

    The moisture basis gives the room's use, 150 + 26 = 176 g/h, with occupants and
    activities: 3 sitting at 50 g/h and a 15-minute shower at 2500 g/h over 24 h = 26 g/h
    (BS 5250 figures via a building-science text [R])."""
    room = RoomInput(
        "Bath", "bathroom", 21.0, 70.0, occupants=3, activities=(Activity("shower", 0.25),)
    )
    estimate = advise.moisture_generation(assess.assess_room(room))
    assert words.moisture_basis(estimate, "bathroom", words.SI) == (
        f"176 g/h from the room's use (3 people sitting at 50 g/h each: 150 g/h; activities "
        f"averaged over the day: {2500 * 0.25 / 24:.0f} g/h)"
    )


def test_the_app_panels_name_frost_below_zero_and_follow_the_units():
    """A state whose condensation point is below 0 °C is given its frost point; the same
    state in IP is written in °F and grains per pound."""
    from survey.words import screens

    cold = psychro.state_from_rh(2.0, 60.0)  # dew point about −4.6 °C: frost point shown
    si = screens.air_state_lines(cold, words.SI, pressure_pa=101_325.0)
    assert si[1].startswith("Frost point ") and si[0] == "2.0 °C, 60 % RH"
    assert si[-1] == "Pressure used 1013.2 hPa"
    ip = screens.air_state_lines(psychro.state_from_rh(21.0, 50.0), words.IP, 0.5)
    assert ip[0].startswith("69.8 °F") and ip[1].startswith("Dew point ")
    assert ip[1].endswith("± 0.9 °F") and "gr/lb" in ip[2]


def test_one_worst_surface_for_every_face():
    """A pane with water forming on it outranks a wall only near the dew point but above the
    mould limit: the room's worst finding names the pane in the words, the app's room list
    and the chart alike (one ordering, :func:`words.worst_first`)."""
    from survey import chart
    from survey.app import judging
    from survey.evaluate import VisitAssessment
    from survey.words import screens

    room = assess.RoomInput(
        "R",
        "bedroom",
        20.0,
        65.0,
        (
            assess.SurfaceInput("wall", 15.0, "external_wall"),  # surface RH ~89 %, margin 1.8 K
            assess.SurfaceInput("pane", 9.0, "glazing"),  # below the 13.2 °C dew point
        ),
    )
    site = assess.assess_site([room], None, 101_325.0)
    finding = site.rooms[0]
    wall, pane = finding.surfaces
    assert pane.condensation is assess.CondensationState.CONDENSING
    assert wall.mould is assess.MouldState.ABOVE
    assert words.worst_first(finding.surfaces)[0] is pane
    assert words.worst_surface(finding.surfaces) is pane
    assert judging.worst_rank(finding) == 3
    assert screens.worst_state_words(finding, words.SI).startswith("water forming")
    judged = VisitAssessment(0, None, site, advise.advise_site(site), ("r",), {})
    (point,) = chart.psychro_chart(judged).points
    assert point.worst_words.startswith("water forming")


def test_the_narrow_surface_rh_cell_keeps_the_band_and_leaves_what_forms_to_the_state():
    """Room air 17.5 °C and 72 % (dew point 12.4 °C, CoolProp): a pane at 6.0 °C is past
    saturation ("≥100 %", the state cell says water forms), a wall at 13.1 °C near 96 % with
    a band reaching 100 % ("≥…"), an internal wall at 20.0 °C near 62 % (surface RH at
    constant humidity ratio from CoolProp). The band itself is the assessment's (checked
    against a Monte Carlo in tests/test_assess_uncertainty.py); here only its brief form is
    checked, against the report's longer text."""
    from survey.words import screens

    dew = HAPropsSI("D", "T", 290.65, "R", 0.72, "P", 101325.0) - 273.15
    assert dew == pytest.approx(12.4, abs=0.05)
    room = assess.RoomInput(
        "Room",
        "bedroom",
        17.5,
        72.0,
        (
            assess.SurfaceInput("Pane", 6.0, "glazing"),
            assess.SurfaceInput("Wall", 13.1, "external_wall"),
            assess.SurfaceInput("Inner", 20.0, "internal_wall"),
        ),
    )
    pane, wall, inner = assess.assess_room(room, None, accuracy=assess.DEFAULT_ACCURACY).surfaces
    assert screens.surface_rh_cell(pane) == "≥100 %"
    assert "water forming" in screens.surface_state_words(pane, words.SI)
    assert wall.surface_rh_high_pct >= 100.0 > inner.surface_rh_high_pct
    ratio = HAPropsSI("W", "T", 290.65, "R", 0.72, "P", 101325.0)
    for s, kelvin, near in ((wall, 286.25, 96), (inner, 293.15, 62)):
        expected = 100 * HAPropsSI("R", "T", kelvin, "W", ratio, "P", 101325.0)
        assert s.surface_rh_pct == pytest.approx(expected, abs=0.3)
        assert round(expected) == near
    for s in (wall, inner):
        cell = screens.surface_rh_cell(s)
        assert cell.startswith(f"{s.surface_rh_pct:.0f} % (")
        if s.surface_rh_high_pct >= 100.0:
            assert cell.endswith(f"(≥{s.surface_rh_low_pct:.0f})")
        else:
            band = f"({s.surface_rh_low_pct:.0f}–{s.surface_rh_high_pct:.0f})"
            assert cell.endswith(band) and band in words.surface_rh_text(s)
        assert len(cell) <= 13
