"""Sections: exact geometric properties of rolled and built-up shapes, and the rolled-section catalog.

See :mod:`calckit.sections.base` for the axis and modulus naming convention.
"""
from .base import Section, SectionProps
from .shapes import BuiltUp, Channel, Hollow, IShape, Plate, PlateGirder, SolidRect, Tee

__all__ = ["Section", "SectionProps", "IShape", "PlateGirder", "Channel", "Tee", "SolidRect", "Hollow",
           "Plate", "BuiltUp", "section", "catalog"]


def section(name: str):
    """A catalog section by name ("W18X50", "IPE 300", "HE 300 B"); see :mod:`calckit.sections.catalog`."""
    from .catalog import section as _section

    return _section(name)


def catalog(family=None, depth=None, mass=None):
    """Catalog rows as sections, filtered by family, depth (min, max) and mass (min, max)."""
    from .catalog import catalog as _catalog

    return _catalog(family=family, depth=depth, mass=mass)
