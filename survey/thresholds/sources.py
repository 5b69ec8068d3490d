"""Names of the sources several limits cite."""

_BRE = "BRE Information Paper IP1/06 (UK guidance), critical temperature factor"
_ISO13788_CLASS = "EN ISO 13788, Annex A, internal humidity classes (vapour-pressure excess)"
_WOOD = "USDA FPL Wood Handbook"
_MOISTURE = (
    "moisture generation rates from a building-science text quoting the BS 5250 "
    "tables (the BS 5250 originals from memory)"
)
_EPA_MOULD = "US EPA, Mold Remediation in Schools and Commercial Buildings (area bands)"
