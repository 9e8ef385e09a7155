~Version Information
 VERS.                 1.2:   CWLS LOG ASCII STANDARD - VERSION 1.2
 WRAP.                 NO:    ONE LINE PER DEPTH STEP
~Well Information Block
#MNEM.UNIT       Data Type    Information
#---------    -------------   ------------------------------
 STRT.M              30.0000:
 STOP.M              31.0000:
 STEP.M               0.5000:
 NULL.             -999.2500:
 COMP.               COMPANY:   GREYSCAR QUARRY LTD
 WELL.                  WELL:   GSQ-BH03
 FLD .                 FIELD:   NORTH WALL EXTENSION
 DATE.              LOG DATE:   12-MAY-2025
~Curve Information Block
 DEPT.M                     :   1  DEPTH
 GR  .GAPI                  :   2  GAMMA RAY
~A  Depth     GR
   30.000   61.50
   30.500 -999.25
   31.000   58.25
