"""Type stubs of the native module (hydrograde._native). SI units throughout."""

from typing import Any, Dict, List, Optional, Tuple, final, overload

import numpy as np
from numpy.typing import ArrayLike, NDArray

__all__ = [
    "ERROR_KINDS",
    "Friction",
    "WARNING_NAMES",
    "__version__",
    "correlation_validity",
    "correlations",
    "darcy_factor",
    "friction",
]
__version__: str
ERROR_KINDS: List[str]
WARNING_NAMES: List[str]

@overload
def darcy_factor(
    re: float,
    rel_roughness: float,
    correlation: Optional[str] = None,
    *,
    laminar_constant: Optional[float] = None,
    laminar_limit: Optional[float] = None,
    turbulent_limit: Optional[float] = None,
    transition: Optional[str] = None,
) -> float: ...
@overload
def darcy_factor(
    re: ArrayLike,
    rel_roughness: ArrayLike,
    correlation: Optional[str] = None,
    *,
    laminar_constant: Optional[float] = None,
    laminar_limit: Optional[float] = None,
    turbulent_limit: Optional[float] = None,
    transition: Optional[str] = None,
) -> NDArray[np.float64]: ...
def friction(
    re: float,
    rel_roughness: float,
    correlation: Optional[str] = None,
    *,
    laminar_constant: Optional[float] = None,
    laminar_limit: Optional[float] = None,
    turbulent_limit: Optional[float] = None,
    transition: Optional[str] = None,
) -> Friction: ...
def correlations() -> List[str]: ...
def correlation_validity(correlation: str) -> Dict[str, float]: ...

@final
class Friction:
    """A Darcy friction factor with its sensitivities."""

    @property
    def f(self) -> float: ...
    @property
    def df_dre(self) -> float: ...
    @property
    def df_drel_roughness(self) -> float: ...
    @property
    def regime(self) -> str: ...
    @property
    def warnings(self) -> List[str]: ...
    def to_dict(self) -> Dict[str, Any]: ...
    def to_dataframe(self) -> Any: ...
    def _repr_html_(self) -> str: ...
    def __reduce__(self) -> Tuple[Any, Tuple[bytes]]: ...
    @classmethod
    def _from_state(cls, state: bytes) -> Friction: ...
    def __eq__(self, value: object, /) -> bool: ...
