"""The PDF calculation report (reportlab). reportlab's layout package, whenever it is first
imported, skips compiling the module-level patterns a report never uses (:mod:`.rl_import`)."""

from .rl_import import install

install()
