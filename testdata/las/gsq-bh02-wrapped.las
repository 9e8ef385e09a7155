~VERSION INFORMATION
 VERS.                  2.0 :   CWLS LOG ASCII STANDARD - VERSION 2.0
 WRAP.                  YES :   MULTIPLE LINES PER DEPTH STEP
~WELL INFORMATION
 STRT.M          14.0000              : START DEPTH
 STOP.M          14.6000              : STOP DEPTH
 STEP.M          0.2000               : STEP
 NULL.           -999.25              : NULL VALUE
 COMP.           GREYSCAR QUARRY LTD  : COMPANY
 WELL.           GSQ-BH02             : WELL
 DATE.           2024-03-14           : LOG DATE
~CURVE INFORMATION
 DEPT.M                               : DEPTH
 GR  .GAPI                            : NATURAL GAMMA
 DEN .G/CC                            : BULK DENSITY
 RES .OHMM                            : RESISTIVITY
 CAL .MM                              : CALIPER
 SP  .MV                              : SPONTANEOUS POTENTIAL
 TEMP.DEGC                            : FLUID TEMPERATURE
 COND.US/CM                           : FLUID CONDUCTIVITY
 VELP.M/S                             : P-WAVE VELOCITY
 PE  .B/E                             : PHOTOELECTRIC FACTOR
 NPHI.V/V                             : NEUTRON POROSITY
~PARAMETER INFORMATION
 BS  .MM          96.0                : BIT SIZE
~A
14.00
    44.10     2.651     121.2      97.1     -12.5
    11.84     412.0    5120.0      3.12     0.081
14.20
    46.30     2.660     119.8      97.4     -12.9
    11.85     411.5    5135.0   -999.25     0.079
14.40
    49.75     2.672   -999.25      98.0     -13.4
    11.86     410.9    5160.0      3.18     0.076
14.60
    51.20     2.681     117.3      97.8     -13.1
    11.87     410.2    5172.5      3.21     0.074
