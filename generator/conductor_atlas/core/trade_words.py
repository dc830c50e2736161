"""The plain words a practitioner types for conductor metal, and how a link names a material by them.

"copper" and "aluminium" mean the conductor grade that is bought and measured (standard annealed
copper, aluminium 1350), not the high-purity element; the chemical symbol keeps meaning the element
(common practice (no source)). The calculators' material lookup (core.lookup) reads them so; a link
that fills a material field (a material page's calculators, a search result) names a pure metal by its
symbol so the calculator opens on that same material.
"""

# word -> [grade id, the element's id, the element's symbol]
TRADE_WORDS = {
    "copper": ["copper-annealed", "copper", "Cu"],
    "aluminium": ["aluminium-1350", "aluminium", "Al"],
    "aluminum": ["aluminium-1350", "aluminium", "Al"],
}


def link_text(material_id):
    """What a link puts in a material field for ``material_id``: the id, or the chemical symbol for a
    pure metal whose id is also a trade word.

    >>> link_text("copper"), link_text("copper-annealed")
    ('Cu', 'copper-annealed')
    """
    if material_id in TRADE_WORDS:
        return TRADE_WORDS[material_id][2]
    return material_id
