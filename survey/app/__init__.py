"""The walk-through app: a keyboard-driven Textual face over the survey core.

:func:`make_app` is the one factory, used by ``survey open``, ``survey demo``, ``survey``
with no arguments and the tests. The app shows the words module's sentences and the typed
findings; it never computes physics or builds advice text. Its non-UI helpers are
:mod:`survey.app.editing` (session, saving, recent surveys) and :mod:`survey.app.judging`
(one room of a stored visit judged, the walk's bookkeeping).
"""

from __future__ import annotations

from pathlib import Path
from typing import TYPE_CHECKING, Any

if TYPE_CHECKING:
    from survey.app.main import SurveyApp


def make_app(
    path: str | Path | None = None,
    *,
    create: str | None = None,
    demo: bool = False,
    data_dir: Path | None = None,
    **options: Any,
) -> SurveyApp:
    """The app: the start screen, or ``path`` opened (created with site reference
    ``create``), or the demo survey. ``data_dir`` holds the recent list and the demo copy
    (the user's data folder by default)."""
    from survey.app.main import SurveyApp

    return SurveyApp(
        path=None if path is None else Path(path),
        create=create,
        demo=demo,
        data_dir=data_dir,
        **options,
    )
