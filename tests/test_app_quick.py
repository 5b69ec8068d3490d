"""The quick-check screen: readings that belong to no survey, judged as ``survey check``
judges them; a value that does not read is named and the last one that did stays in use."""

from __future__ import annotations

import CoolProp.CoolProp as CP
from textual.widgets import Input, Static

from survey.app import make_app
from survey.app.quick import QuickScreen


def shown(app, widget_id: str) -> str:
    return str(app.screen.query_one(f"#{widget_id}", Static).render())


async def type_into(pilot, app, key: str, text: str) -> None:
    box = app.screen.query_one(f"#quick-{key}", Input)
    box.value = text
    await pilot.pause()


async def test_a_value_that_does_not_read_keeps_the_last_good_one_in_the_result(tmp_path):
    """21 °C and 65 % give a dew point of 14.2 °C (CoolProp, at 101 325 Pa); a surface at
    12.5 °C is under it. The surface then typed as "abc" is named under the form, and the
    result still shows the 12.5 °C surface; the air temperature typed as "-" (half of a
    negative number) keeps 21 °C. Nothing is written: the data folder stays empty."""
    data = tmp_path / "data"
    app = make_app(data_dir=data)
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        await pilot.press("f6")
        await pilot.pause()
        assert isinstance(app.screen, QuickScreen)
        assert "Type the air temperature and RH" in shown(app, "quick-result")
        await type_into(pilot, app, "air", "21")
        await type_into(pilot, app, "rh", "65")
        await type_into(pilot, app, "surface", "12.5")
        dew = CP.HAPropsSI("D", "T", 294.15, "R", 0.65, "P", 101325.0) - 273.15
        result = shown(app, "quick-result")
        assert f"{dew:.1f} °C" in result
        assert "12.5 °C" in result
        assert shown(app, "quick-message") == ""

        await type_into(pilot, app, "surface", "abc")
        message = shown(app, "quick-message")
        assert "Not read: surface temperature abc" in message
        assert "the result uses the last value that read, 12.5 °C" in message
        assert shown(app, "quick-result") == result

        await type_into(pilot, app, "air", "-")
        assert "air temperature -" in shown(app, "quick-message")
        assert shown(app, "quick-result") == result  # 21 °C still in use

        await type_into(pilot, app, "surface", "")  # cleared: left out, not kept
        await type_into(pilot, app, "air", "21")
        assert shown(app, "quick-message") == ""
        assert "12.5 °C" not in shown(app, "quick-result")
        assert f"{dew:.1f} °C" in shown(app, "quick-result")
    assert not data.exists() or not any(data.rglob("*.json"))


async def test_a_value_outside_the_cores_domain_is_named_in_its_field_and_the_result_stays(
    tmp_path,
):
    """A stray digit makes 21 °C into 210 °C, outside the air temperatures the psychrometric
    core takes (−50 to 70 °C, its stated domain): the field is named with the value and the
    range, and the result stays the one for 21 °C rather than being replaced by a refusal.
    The same for a surface at 180 °C (the core's surfaces run −60 to 90 °C)."""
    app = make_app(data_dir=tmp_path / "data")
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        await pilot.press("f6")
        await pilot.pause()
        await type_into(pilot, app, "air", "21")
        await type_into(pilot, app, "rh", "65")
        await type_into(pilot, app, "surface", "12.5")
        result = shown(app, "quick-result")
        assert "12.5 °C" in result

        await type_into(pilot, app, "air", "210")
        message = shown(app, "quick-message")
        assert "Not read: air temperature 210" in message
        assert "between -50 and 70 °C" in message
        assert "the result uses the last value that read, 21 °C" in message
        assert shown(app, "quick-result") == result

        await type_into(pilot, app, "air", "21")
        await type_into(pilot, app, "surface", "180")
        message = shown(app, "quick-message")
        assert "Not read: surface temperature 180" in message and "-60 and 90 °C" in message
        assert shown(app, "quick-result") == result


async def test_the_result_scrolls_by_keys_from_a_field(tmp_path):
    """Shift+↓ scrolls the result from the field being typed in, so the cautions at its
    foot are reached without a mouse; Shift+↑ scrolls back."""
    from textual.containers import VerticalScroll

    app = make_app(data_dir=tmp_path / "data")
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("f6")
        await pilot.pause()
        await type_into(pilot, app, "air", "21")
        await type_into(pilot, app, "rh", "85")
        await type_into(pilot, app, "surface", "9")
        app.screen.query_one("#quick-air", Input).focus()
        await pilot.pause()
        panel = app.screen.query_one(".live-panel-scroll", VerticalScroll)
        assert panel.max_scroll_y > 0 and panel.scroll_y == 0
        for _ in range(40):
            await pilot.press("shift+down")
        await pilot.pause()
        assert panel.scroll_y == panel.max_scroll_y
        assert app.focused.id == "quick-air"
        await pilot.press("shift+up")
        await pilot.pause()
        assert panel.scroll_y == panel.max_scroll_y - 3


async def test_volume_occupants_and_a_second_surface_are_taken(tmp_path):
    """The advice asks for the occupants or the room volume to size a dehumidifier; the
    screen takes both (volume as dimensions, with a decimal comma), and a second surface.
    21 °C and 75 % (dew point 16.4 °C, CoolProp) with 2 people: the load is 2 × 50 g/h
    (``moisture_person_sedentary_g_per_h``: our choice in a published 40-60 g/h, from a
    building-science text quoting the BS 5250 tables, the originals from memory), 100 g/h × 24 h =
    2.4 L/day. A volume out of the file's range (0.5 m³; 1 to 100 000 allowed) is named in
    its field and left out."""
    dew = CP.HAPropsSI("D", "T", 294.15, "R", 0.75, "P", 101325.0) - 273.15
    app = make_app(data_dir=tmp_path / "data")
    async with app.run_test(size=(100, 40)) as pilot:
        await pilot.pause()
        await pilot.press("f6")
        await pilot.pause()
        for key, text in (("air", "21"), ("rh", "75"), ("surface", "12"), ("surface2", "19")):
            await type_into(pilot, app, key, text)
        result = shown(app, "quick-result")
        assert f"Dew point {dew:.1f} °C" in result
        assert "Surface 12.0 °C" in result and "Surface 19.0 °C" in result
        assert "no dehumidifier size can be given" in result

        await type_into(pilot, app, "volume", "0,5")
        assert "Not read: room volume 0,5" in shown(app, "quick-message")
        assert "between 1 and 100000 m³" in shown(app, "quick-message")
        await type_into(pilot, app, "volume", "4 x 3 x 2,5")
        await type_into(pilot, app, "occupants", "2")
        assert shown(app, "quick-message") == ""
        result = shown(app, "quick-result")
        assert "2 people sitting at 50 g/h each: 100 g/h" in result
        assert "at least 2.4 L/day" in result
