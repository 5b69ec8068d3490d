"""The one voice of condition-survey: findings, actions, cautions and limits as sentences.

Plain strings, no Rich, no Markdown; numbers written in a :class:`Display`'s units (SI or
IP, chosen by the face, never guessed). The command line, the report and the app only lay
these strings out, so they say the same thing in the same words — and frost is called frost
wherever a surface is below 0 °C.
"""

from survey.words.actions import (
    TITLES,
    action_numbers,
    action_reason,
    action_title,
    moisture_basis,
    target_basis,
)
from survey.words.cautions import CLOSING_TEXT, caution_text
from survey.words.display import IP, SI, Display, round_down_rh, round_up_temperature_c
from survey.words.limits import client_citation, legend, limit_value_text
from survey.words.quick import (
    quick_accuracy_line,
    quick_nothing_to_do,
    quick_room_lines,
    quick_summary_lines,
)
from survey.words.states import (
    CANNOT_TELL,
    CANNOT_TELL_EXPLAINED,
    ELEMENT_WORDS,
    HUMIDITY_CLASS_EXAMPLES,
    USE_PHRASE,
    condensation_text,
    factor_not_judged_reason,
    factor_text,
    humidity_class_range_text,
    humidity_class_text,
    material_rank,
    material_state_brief,
    material_state_words,
    mould_text,
    rh_limit_text,
    short_verdict,
    surface_rank,
    surface_rh_text,
    timber_emc_text,
    worst_first,
    worst_surface,
)

__all__ = [
    "CANNOT_TELL",
    "CANNOT_TELL_EXPLAINED",
    "CLOSING_TEXT",
    "ELEMENT_WORDS",
    "HUMIDITY_CLASS_EXAMPLES",
    "IP",
    "SI",
    "TITLES",
    "USE_PHRASE",
    "Display",
    "action_numbers",
    "action_reason",
    "action_title",
    "caution_text",
    "client_citation",
    "condensation_text",
    "factor_not_judged_reason",
    "factor_text",
    "humidity_class_range_text",
    "humidity_class_text",
    "legend",
    "limit_value_text",
    "material_rank",
    "material_state_brief",
    "material_state_words",
    "moisture_basis",
    "mould_text",
    "quick_accuracy_line",
    "quick_nothing_to_do",
    "quick_room_lines",
    "quick_summary_lines",
    "rh_limit_shown",
    "rh_limit_text",
    "round_down_rh",
    "round_up_temperature_c",
    "short_verdict",
    "surface_rank",
    "surface_rh_text",
    "target_basis",
    "timber_emc_text",
    "worst_first",
    "worst_surface",
]

rh_limit_shown = round_down_rh
