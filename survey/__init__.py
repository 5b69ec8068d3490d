"""condition-survey: moist-air and building-condition assessment for site surveys.

The package is split into a UI-free core (units, psychro, thresholds, assess, advise,
model, store, report) and two faces (the ``survey`` command line and the Textual app).
Importing this package must stay cheap: nothing heavy is imported here.
"""

__version__ = "0.1.0"
