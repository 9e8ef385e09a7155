~VERSION INFORMATION
 VERS.                  2.0 :   CWLS LOG ASCII STANDARD - VERSION 2.0
 WRAP.                   NO :   ONE LINE PER DEPTH STEP
~WELL INFORMATION
#MNEM.UNIT       DATA                   DESCRIPTION
 STRT.M          10.0000              : START DEPTH
 STOP.M          12.0000              : STOP DEPTH
 STEP.M          0.2500               : STEP
 NULL.           -999.25              : NULL VALUE
 COMP.           GREYSCAR QUARRY LTD  : COMPANY
 WELL.           GSQ-BH02             : WELL
 FLD .           GREYSCAR QUARRY      : FIELD
 LOC .           EAST BENCH           : LOCATION
 SRVC.           QUARRY GEOPHYSICS    : SERVICE COMPANY
 DATE.           2024-03-14           : LOG DATE
 UWI .           GSQ-BH02-L1          : UNIQUE WELL ID
~CURVE INFORMATION
 DEPT.M                               : DEPTH
 GR  .GAPI                            : NATURAL GAMMA
 DEN .G/CC                            : BULK DENSITY
 RES .OHMM                            : RESISTIVITY
~PARAMETER INFORMATION
 BS  .MM          96.0                : BIT SIZE
 EKB .M           212.40              : COLLAR ELEVATION
~A  DEPTH     GR       DEN      RES
10.00    45.20    2.650    120.5
10.25    47.85    2.655    118.0
10.50  -999.25    2.661    115.2
10.75    52.10    2.670  -999.25
11.00    55.00    2.702     98.6
11.25    61.35    2.689    101.3
11.50    58.40  -999.25    104.7
11.75    50.05    2.675    110.9
12.00    48.60    2.668    116.4
