~VERSION INFORMATION
 VERS.                  2.0 :   CWLS LOG ASCII STANDARD - VERSION 2.0
 WRAP.                   NO :   ONE LINE PER DEPTH STEP
~WELL INFORMATION
#MNEM.UNIT       DATA                   DESCRIPTION
 STRT.M          20.0000              : START DEPTH
 STOP.M          21.0000              : STOP DEPTH
 STEP.M          0.2500               : STEP
 NULL.           -999.25              : NULL VALUE
 WELL.           GSQ-BH02             : WELL
~CURVE INFORMATION
 DEPT.M                               : DEPTH
 GR  .GAPI                            : NATURAL GAMMA
~A  DEPTH     GR
20.00    45.20
20.25    47.85
20.50    49.10
1e308    51.00
