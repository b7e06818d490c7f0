// Version 1.0.0 of the engine's ruleset as it shipped, kept as data so that a database whose
// decisions name it holds it too (installed or seeded as a retired version). Never edited.
import type { ReleasedRulesetData } from './types'

export const EDDYLEDGER_CORE_1_0_0: ReleasedRulesetData = {
  "id": "eddyledger-core",
  "version": "1.0.0",
  "baseScores": {
    "dns": 50,
    "wrles": 50,
    "wmles": 50,
    "hybrid": 50,
    "urans": 50,
    "rans": 50
  },
  "baseWhy": "Every approach starts level at 50. The rules below raise or lower each score for this case; the total is clamped to 0-100.",
  "rules": [
    {
      "id": "wall-functions-for-large-meshes",
      "title": "Wall functions when a resolved wall is too costly or too thin",
      "stage": "treatment",
      "when": {
        "or": [
          {
            ">": [
              {
                "var": "budgetRatio.rans"
              },
              1
            ]
          },
          {
            ">=": [
              {
                "var": "reynolds"
              },
              100000000
            ]
          }
        ]
      },
      "effects": {
        "wallTreatment": {
          "urans": "wall-function",
          "rans": "wall-function"
        }
      },
      "why": "Resolving the viscous sublayer needs a first cell near **y+ = 1** and some thirty or more layers of prisms. When that RANS mesh does not fit the budget, or the Reynolds number is so high (1e8 and above) that the sublayer is extremely thin, wall functions bridge the sublayer and buffer layer with the log law and let the first cell sit 30 to 100 wall units from the wall. They assume the turbulence is in local equilibrium, which holds in attached boundary layers; later rules return to a resolved wall where it does not.",
      "source": "Launder & Spalding 1974, Comput. Methods Appl. Mech. Eng. 3, 269"
    },
    {
      "id": "recirculation-needs-resolved-wall",
      "title": "Recirculating flow needs a resolved wall",
      "stage": "treatment",
      "when": {
        "==": [
          {
            "var": "separation"
          },
          "massive"
        ]
      },
      "effects": {
        "wallTreatment": {
          "urans": "resolved",
          "rans": "resolved"
        }
      },
      "why": "Near separation and reattachment the wall shear stress passes through zero and the log law does not hold, so the equilibrium assumption behind wall functions fails exactly where the flow is hardest to predict. A resolved wall lets the model itself carry the near-wall behaviour.",
      "source": "Launder & Spalding 1974 (equilibrium assumption); ERCOFTAC Best Practice Guidelines, Casey & Wintergerste 2000 (from memory)"
    },
    {
      "id": "heat-transfer-needs-resolved-wall",
      "title": "Heat transfer needs a resolved wall",
      "stage": "treatment",
      "when": {
        "or": [
          {
            "var": "physics.heatTransfer"
          },
          {
            "in": [
              "heat-transfer",
              {
                "var": "quantities"
              }
            ]
          }
        ]
      },
      "effects": {
        "wallTreatment": {
          "hybrid": "resolved",
          "urans": "resolved",
          "rans": "resolved"
        },
        "cautions": [
          "Heat transfer: keep the first cell centre at y+ ≤ 1 over every heated or cooled wall and check it on the solution; wall functions give unreliable heat flux wherever the boundary layer is not in equilibrium."
        ]
      },
      "why": "The thermal sublayer sets the wall heat flux, and wall-function estimates of it are unreliable in impinging, separating or accelerating flow. Where heat transfer matters, resolve the wall (**y+ ≤ 1**) and let the model integrate to it.",
      "source": "ERCOFTAC Best Practice Guidelines, Casey & Wintergerste 2000 (from memory)"
    },
    {
      "id": "transition-needs-resolved-wall",
      "title": "Transition prediction needs a resolved wall",
      "stage": "treatment",
      "when": {
        "var": "physics.transition"
      },
      "effects": {
        "wallTreatment": {
          "hybrid": "resolved",
          "urans": "resolved",
          "rans": "resolved"
        }
      },
      "why": "Transition models follow the growth of disturbances inside the laminar boundary layer and are calibrated on meshes with the first cell at **y+ ≈ 1**; a wall function assumes a turbulent layer and removes what they need.",
      "source": "Langtry & Menter 2009, AIAA J. 47, 2894"
    },
    {
      "id": "no-log-layer-for-wall-functions",
      "title": "Boundary layer too thin for a log layer",
      "stage": "treatment",
      "when": {
        "<": [
          {
            "var": "deltaPlus"
          },
          300
        ]
      },
      "effects": {
        "wallTreatment": {
          "hybrid": "resolved",
          "urans": "resolved",
          "rans": "resolved"
        }
      },
      "why": "The log layer runs from about y+ = 30 to about a tenth of the boundary-layer thickness. With the thickness below about 300 wall units there is no log layer for a wall-function cell to sit in, so the wall is resolved.",
      "source": "Law of the wall, e.g. Pope, Turbulent Flows 2000, ch. 7 (from memory)"
    },
    {
      "id": "attached-boundary-layers-suit-rans",
      "title": "Attached boundary layers suit steady RANS",
      "stage": "scoring",
      "when": {
        "==": [
          {
            "var": "separation"
          },
          "none"
        ]
      },
      "effects": {
        "scores": {
          "hybrid": -10,
          "urans": -5,
          "rans": 25
        }
      },
      "why": "RANS models are calibrated on attached wall-bounded flows, and there they predict skin friction and pressure reliably at a small fraction of the cost of resolving the eddies. Without separation there is little unsteadiness to capture; a hybrid method would run as RANS in the boundary layers anyway, and its switch can misbehave on grids whose wall-parallel spacing is of the order of the boundary-layer thickness.",
      "source": "Rumsey & Jeyapaul 2012; Slotnick et al. 2014, NASA/CR-2014-218178; Spalart et al. 2006, Theor. Comput. Fluid Dyn. 20, 181"
    },
    {
      "id": "streamlined-aerodynamics-one-equation-model",
      "title": "Attached external aerodynamics: a one-equation model built for it",
      "stage": "scoring",
      "when": {
        "and": [
          {
            "==": [
              {
                "var": "regime"
              },
              "external"
            ]
          },
          {
            "==": [
              {
                "var": "geometry"
              },
              "streamlined"
            ]
          },
          {
            "==": [
              {
                "var": "separation"
              },
              "none"
            ]
          }
        ]
      },
      "effects": {
        "scores": {
          "rans": 5
        },
        "models": {
          "urans": "Spalart-Allmaras",
          "rans": "Spalart-Allmaras"
        }
      },
      "why": "The Spalart-Allmaras model was built and calibrated for attached aerodynamic flows over wings and bodies. With one transport equation it is robust and cheap, and it is a standard choice for forces on streamlined shapes; k-omega SST is the usual second opinion.",
      "source": "Spalart & Allmaras 1992, AIAA Paper 92-0439"
    },
    {
      "id": "mild-separation",
      "title": "Mild separation: RANS with an adverse-pressure-gradient model, compared",
      "stage": "scoring",
      "when": {
        "==": [
          {
            "var": "separation"
          },
          "mild"
        ]
      },
      "effects": {
        "scores": {
          "wmles": 5,
          "hybrid": 5,
          "rans": 10
        },
        "models": {
          "urans": "k-omega SST",
          "rans": "k-omega SST"
        },
        "cautions": [
          "Mild separation: the onset and extent of separation differ between RANS models; run at least two (for example k-omega SST and Spalart-Allmaras) and treat the spread as part of the uncertainty."
        ]
      },
      "why": "Small separated regions are within reach of RANS, and k-omega SST limits the shear stress in adverse pressure gradients for that purpose. Its predictions of where separation starts and ends are still the weak point, so the result deserves a second model.",
      "source": "Menter 1994, AIAA J. 32, 1598; Rumsey & Jeyapaul 2012"
    },
    {
      "id": "massive-separation-favours-resolving",
      "title": "Massive separation favours resolving the separated eddies",
      "stage": "scoring",
      "when": {
        "==": [
          {
            "var": "separation"
          },
          "massive"
        ]
      },
      "effects": {
        "scores": {
          "wrles": 5,
          "wmles": 15,
          "hybrid": 25,
          "urans": 10,
          "rans": -25
        },
        "cautions": [
          "Massive separation: with a hybrid method keep the boundary layers shielded (DDES or IDDES), make the cells nearly isotropic in the separated region, and check that resolved turbulence appears early in the separated shear layers."
        ]
      },
      "why": "In massively separated flow the large eddies carry most of the momentum exchange and they depend on the geometry, which no RANS calibration captures. Hybrid RANS-LES keeps RANS in the attached boundary layers and resolves the separated region, which suits high Reynolds numbers; wall-modelled LES resolves more of the flow at a higher cost.",
      "source": "Spalart 2009, Annu. Rev. Fluid Mech. 41, 181; Menter et al. 2021, Appl. Sci. 11, 2459"
    },
    {
      "id": "bluff-bodies-shed-vortices",
      "title": "Bluff bodies shed vortices",
      "stage": "scoring",
      "when": {
        "==": [
          {
            "var": "geometry"
          },
          "bluff"
        ]
      },
      "effects": {
        "scores": {
          "hybrid": 5,
          "urans": 5,
          "rans": -5
        }
      },
      "why": "Flow behind a bluff body separates at its edges and sheds vortices periodically; a steady solution averages that away, and the time-averaged wake it predicts is often too long.",
      "source": "Rodi 1997, J. Wind Eng. Ind. Aerodyn. 69-71, 55 (from memory)"
    },
    {
      "id": "unsteady-quantities-need-unsteady-methods",
      "title": "Unsteady loads or noise need a time-resolved method",
      "stage": "scoring",
      "when": {
        "or": [
          {
            "in": [
              "unsteady-loads",
              {
                "var": "quantities"
              }
            ]
          },
          {
            "in": [
              "noise",
              {
                "var": "quantities"
              }
            ]
          },
          {
            "var": "physics.acoustics"
          }
        ]
      },
      "effects": {
        "scores": {
          "dns": 5,
          "wrles": 10,
          "wmles": 15,
          "hybrid": 15,
          "urans": 5,
          "rans": -30
        }
      },
      "why": "A steady RANS result has no fluctuations, so peak loads, fatigue spectra and acoustic sources are not in it. URANS captures deterministic unsteadiness such as regular shedding; the broadband part needs the eddies resolved.",
      "source": "Menter et al. 2021, Appl. Sci. 11, 2459"
    },
    {
      "id": "broadband-noise-needs-resolved-turbulence",
      "title": "Broadband noise needs resolved turbulence",
      "stage": "scoring",
      "when": {
        "or": [
          {
            "in": [
              "noise",
              {
                "var": "quantities"
              }
            ]
          },
          {
            "var": "physics.acoustics"
          }
        ]
      },
      "effects": {
        "scores": {
          "urans": -15,
          "rans": -10
        },
        "cautions": [
          "Noise: the cell size and time step set the highest frequency resolved; size them for the band you need, and carry the sources to the listener with an acoustic analogy (for example Ffowcs Williams-Hawkings) rather than through the CFD mesh."
        ]
      },
      "why": "Broadband noise comes from the turbulent eddies themselves. URANS returns only the tonal, deterministic part of the sources, and steady RANS none.",
      "source": "Ffowcs Williams & Hawkings 1969, Phil. Trans. R. Soc. A 264, 321; Menter et al. 2021, Appl. Sci. 11, 2459"
    },
    {
      "id": "turbulence-statistics-need-resolved-eddies",
      "title": "Turbulence statistics need resolved eddies",
      "stage": "scoring",
      "when": {
        "in": [
          "statistics",
          {
            "var": "quantities"
          }
        ]
      },
      "effects": {
        "scores": {
          "dns": 25,
          "wrles": 20,
          "wmles": 5,
          "hybrid": -5,
          "urans": -20,
          "rans": -25
        }
      },
      "why": "Reynolds stresses, spectra and higher moments come out of a simulation only for the eddies it resolves. DNS resolves them all; wall-resolved LES all but the smallest; RANS models them entirely and has none to report.",
      "source": "Pope, Turbulent Flows 2000; Moin & Mahesh 1998, Annu. Rev. Fluid Mech. 30, 539"
    },
    {
      "id": "turbulent-mixing",
      "title": "Turbulent mixing is carried by the large eddies",
      "stage": "scoring",
      "when": {
        "in": [
          "mixing",
          {
            "var": "quantities"
          }
        ]
      },
      "effects": {
        "scores": {
          "wrles": 5,
          "wmles": 10,
          "hybrid": 10,
          "urans": -5,
          "rans": -10
        }
      },
      "why": "Mixing in jets, wakes and shear layers is done by large, unsteady eddies; RANS represents it by gradient diffusion with a tuned turbulent Schmidt or Prandtl number, and the fluctuations that drive thermal fatigue are absent.",
      "source": "Menter et al. 2021, Appl. Sci. 11, 2459"
    },
    {
      "id": "heat-transfer-model",
      "title": "Heat transfer: a two-equation model integrated to the wall",
      "stage": "scoring",
      "when": {
        "or": [
          {
            "var": "physics.heatTransfer"
          },
          {
            "in": [
              "heat-transfer",
              {
                "var": "quantities"
              }
            ]
          }
        ]
      },
      "effects": {
        "scores": {
          "wrles": 5,
          "wmles": -10
        },
        "models": {
          "urans": "k-omega SST",
          "rans": "k-omega SST"
        }
      },
      "why": "k-omega SST integrates to the wall without damping functions and is a common choice for wall heat transfer. Wall models for the heat flux in LES are less mature than those for the shear stress, which counts against wall-modelled LES.",
      "source": "Menter 1994, AIAA J. 32, 1598; Larsson et al. 2016, Mech. Eng. Rev. 3 (from memory)"
    },
    {
      "id": "rotation-and-swirl",
      "title": "Rotation or swirl: a curvature-corrected model",
      "stage": "scoring",
      "when": {
        "or": [
          {
            "var": "physics.rotation"
          },
          {
            "==": [
              {
                "var": "geometry"
              },
              "rotating"
            ]
          }
        ]
      },
      "effects": {
        "scores": {
          "urans": 5
        },
        "models": {
          "urans": "k-omega SST with rotation-curvature correction",
          "rans": "k-omega SST with rotation-curvature correction"
        },
        "cautions": [
          "Rotation or swirl: eddy-viscosity models do not feel how rotation and streamline curvature damp or amplify turbulence; the curvature correction helps, but compare with a Reynolds-stress model (for example SSG/LRR-omega) before trusting swirl decay, vortex cores or separation."
        ]
      },
      "why": "System rotation and strong streamline curvature change the turbulence in ways an isotropic eddy viscosity cannot represent. A rotation-curvature correction sensitises the model to them; a Reynolds-stress model contains the effect in its equations. Strong swirl often precesses or breaks down unsteadily, which favours a time-resolved run.",
      "source": "Smirnov & Menter 2009, J. Turbomach. 131, 041010; Spalart & Shur 1997, Aerosp. Sci. Technol. 1, 297"
    },
    {
      "id": "laminar-turbulent-transition",
      "title": "Laminar-turbulent transition: a transition model",
      "stage": "scoring",
      "when": {
        "var": "physics.transition"
      },
      "effects": {
        "scores": {
          "dns": 5,
          "wrles": 10,
          "wmles": -25,
          "hybrid": -10
        },
        "models": {
          "urans": "k-omega SST with gamma-Re-theta transition",
          "rans": "k-omega SST with gamma-Re-theta transition"
        },
        "cautions": [
          "Transition: set the free-stream turbulence intensity and its decay up to the body as in the test or in service, refine the streamwise spacing where transition is expected, and compare with a fully turbulent run."
        ]
      },
      "why": "Where transition moves with the flow conditions, a correlation-based transition model lets the RANS solution find it. Wall models and shielded hybrid methods assume a turbulent boundary layer from the start; wall-resolved LES and DNS can follow transition itself if the inflow disturbances are right.",
      "source": "Langtry & Menter 2009, AIAA J. 47, 2894"
    },
    {
      "id": "buoyancy",
      "title": "Buoyancy changes the turbulence",
      "stage": "scoring",
      "when": {
        "var": "physics.buoyancy"
      },
      "effects": {
        "scores": {
          "urans": 5
        },
        "cautions": [
          "Buoyancy: include buoyancy production in the turbulence equations, check whether the flow is driven by buoyancy (Richardson number), and expect stable stratification to need a Reynolds-stress model or a scale-resolving method."
        ]
      },
      "why": "Buoyancy produces or destroys turbulence depending on the stratification, and buoyant plumes are often unsteady, which favours a time-resolved solution.",
      "source": "common practice, no source"
    },
    {
      "id": "compressibility",
      "title": "Compressible flow above Mach 0.3",
      "stage": "scoring",
      "when": {
        ">": [
          {
            "var": "mach"
          },
          0.3
        ]
      },
      "effects": {
        "cautions": [
          "Mach above 0.3: density changes exceed about 5%, so use a compressible solver; the skin-friction correlations used here are incompressible and over-estimate the friction as Mach rises."
        ]
      },
      "why": "In isentropic flow the density drop reaches about 5% at Mach 0.3, the usual limit for treating a gas as incompressible.",
      "source": "Isentropic flow relations, e.g. Anderson, Modern Compressible Flow (from memory)"
    },
    {
      "id": "supersonic-flow",
      "title": "Supersonic flow",
      "stage": "scoring",
      "when": {
        ">": [
          {
            "var": "mach"
          },
          1
        ]
      },
      "effects": {
        "cautions": [
          "Supersonic: shocks need shock-capturing schemes and local refinement that these cell counts do not include; shock-boundary-layer interaction is a known weakness of RANS models."
        ]
      },
      "why": "Above Mach 1 shocks form, and their interaction with boundary layers is a hard case for every turbulence approach.",
      "source": "Anderson, Modern Compressible Flow (from memory)"
    },
    {
      "id": "plate-may-be-laminar",
      "title": "The boundary layer may still be laminar",
      "stage": "scoring",
      "when": {
        "and": [
          {
            "==": [
              {
                "var": "regime"
              },
              "external"
            ]
          },
          {
            "<": [
              {
                "var": "reynolds"
              },
              500000
            ]
          },
          {
            "!": {
              "var": "physics.transition"
            }
          }
        ]
      },
      "effects": {
        "cautions": [
          "Reynolds number below about 5e5: the boundary layer may be laminar over much of the wall. The turbulent skin friction used for the wall spacing then errs on the fine side; consider marking transition so a transition model is chosen."
        ]
      },
      "why": "On a smooth flat plate with quiet inflow, transition is commonly placed near Re_x = 5e5 (from 3e5 to 3e6 with free-stream turbulence).",
      "source": "Schlichting, Boundary-Layer Theory (from memory)"
    },
    {
      "id": "laminar-duct-flow",
      "title": "Laminar duct flow needs no turbulence model",
      "stage": "scoring",
      "when": {
        "and": [
          {
            "==": [
              {
                "var": "regime"
              },
              "internal"
            ]
          },
          {
            "<": [
              {
                "var": "reynolds"
              },
              2300
            ]
          }
        ]
      },
      "effects": {
        "scores": {
          "dns": 30,
          "wrles": -10,
          "wmles": -30,
          "hybrid": -20,
          "urans": -20,
          "rans": -20
        },
        "cautions": [
          "Reynolds number below about 2300: duct flow is laminar. Solve the Navier-Stokes equations without a turbulence model (the DNS entry); the costs listed assume turbulence and overstate a laminar run."
        ]
      },
      "why": "Below a Reynolds number of about 2300 disturbances in pipe flow decay and the flow stays laminar; a direct solution is then exact and cheap.",
      "source": "Reynolds 1883, Phil. Trans. R. Soc. 174, 935 (from memory)"
    },
    {
      "id": "resolution-within-budget",
      "title": "Resolving the eddies fits the budget",
      "stage": "scoring",
      "when": {
        "or": [
          {
            "var": "feasible.dns"
          },
          {
            "var": "feasible.wrles"
          },
          {
            "var": "feasible.wmles"
          }
        ]
      },
      "effects": {
        "scores": {
          "dns": {
            "if": [
              {
                "var": "feasible.dns"
              },
              15,
              0
            ]
          },
          "wrles": {
            "if": [
              {
                "var": "feasible.wrles"
              },
              10,
              0
            ]
          },
          "wmles": {
            "if": [
              {
                "var": "feasible.wmles"
              },
              5,
              0
            ]
          }
        }
      },
      "why": "When the budget affords it, resolving more of the turbulence removes modelling error: DNS models nothing, LES only the smallest eddies.",
      "source": "Moin & Mahesh 1998, Annu. Rev. Fluid Mech. 30, 539; Pope, Turbulent Flows 2000"
    },
    {
      "id": "short-log-layer-for-wall-model",
      "title": "Boundary layer too thin for a wall model",
      "stage": "scoring",
      "when": {
        "<": [
          {
            "var": "deltaPlus"
          },
          1200
        ]
      },
      "effects": {
        "scores": {
          "wmles": -20
        }
      },
      "why": "Wall-modelled LES uses cells of about a twentieth of the boundary-layer thickness and matches the wall model in the log layer, at y+ of 30 or more. Both fit only when the thickness exceeds about 1200 wall units; below that a wall-resolved LES costs little more and models less.",
      "source": "Larsson et al. 2016, Mech. Eng. Rev. 3 (from memory)"
    },
    {
      "id": "over-budget",
      "title": "Approaches beyond the budget",
      "stage": "scoring",
      "when": {
        "or": [
          {
            ">": [
              {
                "var": "budgetRatio.dns"
              },
              1
            ]
          },
          {
            ">": [
              {
                "var": "budgetRatio.wrles"
              },
              1
            ]
          },
          {
            ">": [
              {
                "var": "budgetRatio.wmles"
              },
              1
            ]
          },
          {
            ">": [
              {
                "var": "budgetRatio.hybrid"
              },
              1
            ]
          },
          {
            ">": [
              {
                "var": "budgetRatio.urans"
              },
              1
            ]
          },
          {
            ">": [
              {
                "var": "budgetRatio.rans"
              },
              1
            ]
          }
        ]
      },
      "effects": {
        "scores": {
          "dns": {
            "if": [
              {
                ">": [
                  {
                    "var": "budgetRatio.dns"
                  },
                  100
                ]
              },
              -60,
              {
                ">": [
                  {
                    "var": "budgetRatio.dns"
                  },
                  1
                ]
              },
              -40,
              0
            ]
          },
          "wrles": {
            "if": [
              {
                ">": [
                  {
                    "var": "budgetRatio.wrles"
                  },
                  100
                ]
              },
              -60,
              {
                ">": [
                  {
                    "var": "budgetRatio.wrles"
                  },
                  1
                ]
              },
              -40,
              0
            ]
          },
          "wmles": {
            "if": [
              {
                ">": [
                  {
                    "var": "budgetRatio.wmles"
                  },
                  100
                ]
              },
              -60,
              {
                ">": [
                  {
                    "var": "budgetRatio.wmles"
                  },
                  1
                ]
              },
              -40,
              0
            ]
          },
          "hybrid": {
            "if": [
              {
                ">": [
                  {
                    "var": "budgetRatio.hybrid"
                  },
                  100
                ]
              },
              -60,
              {
                ">": [
                  {
                    "var": "budgetRatio.hybrid"
                  },
                  1
                ]
              },
              -40,
              0
            ]
          },
          "urans": {
            "if": [
              {
                ">": [
                  {
                    "var": "budgetRatio.urans"
                  },
                  100
                ]
              },
              -60,
              {
                ">": [
                  {
                    "var": "budgetRatio.urans"
                  },
                  1
                ]
              },
              -40,
              0
            ]
          },
          "rans": {
            "if": [
              {
                ">": [
                  {
                    "var": "budgetRatio.rans"
                  },
                  100
                ]
              },
              -60,
              {
                ">": [
                  {
                    "var": "budgetRatio.rans"
                  },
                  1
                ]
              },
              -40,
              0
            ]
          }
        }
      },
      "why": "An approach that needs more core-hours or more wall-clock time than the budget cannot be run as planned: it loses 40 points, and 60 when it is more than a hundred times over.",
      "source": "common practice, no source"
    }
  ]
}
